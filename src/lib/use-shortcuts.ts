import { useEffect, useRef } from 'react';

export type Shortcut = { key: string; label: string; run: () => void };

/** typing into a field, a select or an editable area is never taken for a shortcut */
function isTyping(target: EventTarget | null): boolean {
  if (!(target instanceof HTMLElement)) return false;
  if (target.isContentEditable) return true;
  const tag = target.tagName;
  if (tag === 'TEXTAREA' || tag === 'SELECT') return true;
  if (tag !== 'INPUT') return false;
  const type = (target as HTMLInputElement).type;
  return !['checkbox', 'radio', 'button', 'submit', 'reset'].includes(type);
}

/**
 * Single-key shortcuts for a page: one keydown listener on the document, ignored while the reader types in a
 * field, while a modifier (Ctrl, Alt, Meta) is held, and for repeats. The page lists the same `shortcuts`.
 */
export function useShortcuts(shortcuts: Shortcut[], enabled = true) {
  const current = useRef(shortcuts);
  current.current = shortcuts;
  useEffect(() => {
    if (!enabled) return;
    const onKey = (e: KeyboardEvent) => {
      if (e.defaultPrevented || e.repeat || e.ctrlKey || e.altKey || e.metaKey || isTyping(e.target)) return;
      const hit = current.current.find((s) => s.key === e.key);
      if (!hit) return;
      e.preventDefault();
      hit.run();
    };
    document.addEventListener('keydown', onKey);
    return () => document.removeEventListener('keydown', onKey);
  }, [enabled]);
}
