import { useUnits } from '../lib/units';

const looks = {
  // in the dark header
  header: {
    group: 'border-paper/30 text-xs',
    on: 'bg-paper text-ink',
    off: 'text-paper/85 hover:text-paper',
    labels: { metric: 'mm · N·m', imperial: 'in · lbf·ft' },
  },
  // on a page, e.g. the calculators
  page: {
    group: 'border-ink/30 bg-paper-card text-sm',
    on: 'bg-ink text-paper',
    off: 'text-ink hover:bg-ink-faint',
    labels: { metric: 'Metric', imperial: 'Imperial' },
  },
} as const;

/** Metric / imperial switch; the choice is kept in localStorage by the units context. */
export function UnitsToggle({ look = 'header', label = 'Units' }: { look?: keyof typeof looks; label?: string }) {
  const { system, setSystem } = useUnits();
  const l = looks[look];
  return (
    <div role="group" aria-label={label} className={`inline-flex rounded-md border p-0.5 font-bold ${l.group}`}>
      {(['metric', 'imperial'] as const).map((s) => (
        <button
          key={s}
          type="button"
          aria-pressed={system === s}
          onClick={() => setSystem(s)}
          className={`min-h-8 rounded px-2 py-1 ${system === s ? l.on : l.off}`}
        >
          {l.labels[s]}
        </button>
      ))}
    </div>
  );
}
