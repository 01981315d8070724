import { useUnits } from '../../lib/units';

export function UnitsToggle() {
  const { system, setSystem } = useUnits();
  return (
    <div role="group" aria-label="Units" className="inline-flex rounded-md border border-paper/30 p-0.5 text-xs font-bold">
      {(['metric', 'imperial'] as const).map((s) => (
        <button
          key={s}
          type="button"
          aria-pressed={system === s}
          onClick={() => setSystem(s)}
          className={`rounded px-2 py-1 ${system === s ? 'bg-paper text-ink' : 'text-paper/85 hover:text-paper'}`}
        >
          {s === 'metric' ? 'mm · N·m' : 'in · lbf·ft'}
        </button>
      ))}
    </div>
  );
}
