import type { RecordedNumber } from '@shared/schemas/graph';

/** Part numbers as recorded; an older stamp read from a record's notes says so. */
export function NumbersList({ numbers }: { numbers: RecordedNumber[] }) {
  return (
    <ul className="flex flex-wrap gap-2">
      {numbers.map((n) => (
        <li key={`${n.partId}-${n.number}`} className="rounded-md border border-ink/15 bg-paper px-2 py-1 text-sm">
          <span className="font-mono">{n.number}</span>
          {n.source === 'stamp' && <span className="ml-1 text-xs text-graphite-soft">(stamp from notes)</span>}
        </li>
      ))}
    </ul>
  );
}
