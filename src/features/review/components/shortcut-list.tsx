import type { Shortcut } from '../../../lib/use-shortcuts';

/** The page's keyboard shortcuts, listed where the moderator works (they do nothing while typing in a field). */
export function ShortcutList({ shortcuts }: { shortcuts: Shortcut[] }) {
  return (
    <details open className="mt-4 rounded-lg border border-ink/10 bg-paper-card px-3 py-2 text-sm" data-testid="shortcuts">
      <summary className="cursor-pointer font-bold text-ink">Keyboard shortcuts</summary>
      <ul className="mt-2 grid gap-1 sm:grid-cols-2">
        {shortcuts.map((s) => (
          <li key={s.key} className="flex items-center gap-2">
            <kbd className="min-w-7 rounded border border-graphite/30 bg-paper px-1.5 py-0.5 text-center font-mono text-xs font-bold">
              {s.key}
            </kbd>
            <span className="text-graphite">{s.label}</span>
          </li>
        ))}
      </ul>
      <p className="mt-2 text-xs text-graphite-soft">Shortcuts wait while you type in a field.</p>
    </details>
  );
}
