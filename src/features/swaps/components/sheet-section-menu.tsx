import { useEffect, useRef, useState, type RefObject } from 'react';

type Entry = { id: string; label: string };

/** The sheet's sections as the page draws them, the ones added by other features included (by their heading's screen words). */
function sectionsIn(root: HTMLElement): Entry[] {
  return [...root.querySelectorAll<HTMLElement>('section[id][aria-labelledby]')]
    .filter((s) => s.getClientRects().length > 0 && !s.parentElement?.closest('section'))
    .map((s) => ({ id: s.id, label: document.getElementById(s.getAttribute('aria-labelledby')!)?.innerText.trim() ?? s.id }))
    .filter((e) => e.label);
}

/** The section whose heading last passed under the bar: what the reader is looking at. */
function currentSection(root: HTMLElement, entries: Entry[]): string | null {
  let current: string | null = null;
  for (const e of entries) {
    const el = root.querySelector(`#${CSS.escape(e.id)}`);
    if (el && el.getBoundingClientRect().top < 96) current = e.id;
  }
  return current;
}

/**
 * A bar that stays at the top of the screen while the sheet scrolls: which section is in view, and a menu that
 * jumps to any of them. On a phone the sheet is many screens tall; this is the way around it.
 */
export function SheetSectionMenu({ sheet }: { sheet: RefObject<HTMLElement | null> }) {
  const [open, setOpen] = useState(false);
  const [entries, setEntries] = useState<Entry[]>([]);
  const [current, setCurrent] = useState<string | null>(null);
  const button = useRef<HTMLButtonElement>(null);

  useEffect(() => {
    const root = sheet.current;
    if (!root) return;
    let frame = 0;
    const update = () => {
      frame = 0;
      const found = sectionsIn(root);
      setEntries((old) => (JSON.stringify(old) === JSON.stringify(found) ? old : found));
      setCurrent(currentSection(root, found));
    };
    const schedule = () => {
      if (!frame) frame = requestAnimationFrame(update);
    };
    update();
    // sections that load later (fitted reports, the reader's own panels) join the menu when they appear
    const observer = new MutationObserver(schedule);
    observer.observe(root, { childList: true, subtree: true });
    window.addEventListener('scroll', schedule, { passive: true });
    window.addEventListener('resize', schedule);
    return () => {
      observer.disconnect();
      window.removeEventListener('scroll', schedule);
      window.removeEventListener('resize', schedule);
      if (frame) cancelAnimationFrame(frame);
    };
  }, [sheet]);

  useEffect(() => {
    if (!open) return;
    const onKey = (e: KeyboardEvent) => {
      if (e.key === 'Escape') {
        setOpen(false);
        button.current?.focus();
      }
    };
    document.addEventListener('keydown', onKey);
    return () => document.removeEventListener('keydown', onKey);
  }, [open]);

  if (entries.length < 3) return null;
  const currentLabel = entries.find((e) => e.id === current)?.label;
  return (
    <nav
      aria-label="Sections of this sheet"
      className="no-print sticky top-0 z-30 -mx-4 mb-6 border-b border-ink/15 bg-paper/95 px-4 py-2 backdrop-blur sm:-mx-6 sm:px-6"
    >
      <div className="flex items-center gap-3">
        <button
          ref={button}
          type="button"
          aria-expanded={open}
          aria-controls="sheet-sections"
          onClick={() => setOpen((o) => !o)}
          className="inline-flex min-h-10 shrink-0 items-center gap-2 rounded-md border border-ink/25 bg-paper-card px-3 text-sm font-bold text-ink hover:border-ink"
        >
          <svg viewBox="0 0 20 20" className="h-4 w-4" aria-hidden>
            <path d="M3 5h14M3 10h14M3 15h9" stroke="currentColor" strokeWidth="2" strokeLinecap="round" />
          </svg>
          Sections
        </button>
        <p className="min-w-0 truncate text-sm text-graphite-soft" aria-live="off" data-testid="section-in-view">
          {currentLabel ?? 'Top of the sheet'}
        </p>
        <a href="#main" className="ml-auto shrink-0 text-sm font-bold text-ink underline decoration-brass underline-offset-2">
          Top
        </a>
      </div>
      {open && (
        <ul
          id="sheet-sections"
          className="mt-2 grid max-h-[70vh] gap-1 overflow-y-auto rounded-lg border border-ink/15 bg-paper-card p-2 shadow-lg sm:grid-cols-2 lg:grid-cols-3"
        >
          {entries.map((e) => (
            <li key={e.id}>
              <a
                href={`#${e.id}`}
                aria-current={e.id === current ? 'location' : undefined}
                onClick={() => setOpen(false)}
                className={`flex min-h-10 items-center rounded-md px-3 text-sm font-bold ${e.id === current ? 'bg-ink text-paper-card' : 'text-ink hover:bg-ink-faint'}`}
              >
                {e.label}
              </a>
            </li>
          ))}
        </ul>
      )}
    </nav>
  );
}
