import type { ProfilePoint } from '@shared/schemas/swap-data';
import { inToMm, mmToIn } from '@shared/fitment/units';
import { TextInput } from '../../../components/ui/field';
import { Button } from '../../../components/ui/button';
import { WheelMeasureGuide } from '../../../components/wheel-measure-guide';
import { numberKeyboard, readNumber } from '../../../lib/number-text';
import { useUnits } from '../../../lib/units';

/** One (z, r) row as typed, in the reader's length unit. */
export type ProfileRow = { z: string; r: string };

const shown = (mm: number, imperial: boolean) => String(imperial ? Math.round(mmToIn(mm) * 1000) / 1000 : mm);

export const rowsOf = (profile: ProfilePoint[] | null, imperial: boolean): ProfileRow[] =>
  (profile ?? []).map((p) => ({ z: shown(p.zMm, imperial), r: shown(p.rMm, imperial) }));

/**
 * The typed rows as points in mm, or null when none is filled in. A row with one figure, or text that is not a number,
 * stays as NaN so the shared schema names that row's field.
 */
export function profileOf(rows: ProfileRow[], imperial: boolean): ProfilePoint[] | null {
  const filled = rows.filter((row) => row.z.trim() !== '' || row.r.trim() !== '');
  if (filled.length === 0) return null;
  const mm = (text: string) => {
    const v = readNumber(text.replace(/[\u2212\u2013]/g, '-'));
    if (v === undefined) return Number.NaN;
    return imperial ? Math.round(inToMm(v) * 10) / 10 : v;
  };
  return filled.map((row) => ({ zMm: mm(row.z), rMm: mm(row.r) }));
}

/** The wheel's inside, point by point, with the measuring guide: barrel first, then the fillet, then the spokes. */
export function WheelProfileFields({
  rows,
  onChange,
  errors,
}: {
  rows: ProfileRow[];
  onChange: (rows: ProfileRow[]) => void;
  /** server or schema reasons, keyed `wheelInsideProfile.<i>.zMm` and so on */
  errors: Record<string, string>;
}) {
  const { lengthUnit } = useUnits();
  const shownRows = rows.length > 0 ? rows : [];
  const edit = (i: number, key: keyof ProfileRow, value: string) =>
    onChange(shownRows.map((row, j) => (j === i ? { ...row, [key]: value } : row)));
  return (
    <fieldset className="grid gap-3 rounded-lg border border-graphite/15 p-3 sm:col-span-2 lg:col-span-3">
      <legend className="px-1 text-sm font-bold text-graphite">Wheel inside profile (optional)</legend>
      <p className="text-sm text-graphite-soft">
        Recorded once, it is drawn against each swap’s caliper on its sheet, with the nearest point measured. z is the depth from
        the wheel’s mounting face, outboard positive; r is the radius from the centre. Start at the barrel and work inward.
      </p>
      <details className="rounded-lg bg-paper p-3">
        <summary className="cursor-pointer text-sm font-bold text-ink">How to measure it</summary>
        <WheelMeasureGuide className="mt-3" />
      </details>
      {errors.wheelInsideProfile && (
        <p role="alert" className="text-sm font-semibold text-oxide">
          {errors.wheelInsideProfile}
        </p>
      )}
      <ol className="grid gap-2">
        {shownRows.map((row, i) => (
          <li key={i} className="grid grid-cols-[auto_1fr_1fr_auto] items-end gap-2" aria-label={`Point ${i + 1}`}>
            <span className="tabular pb-3 text-sm font-bold text-graphite-soft">{i + 1}</span>
            <TextInput
              label={`z (${lengthUnit})`}
              {...numberKeyboard(true)}
              value={row.z}
              onChange={(e) => edit(i, 'z', e.target.value)}
              error={errors[`wheelInsideProfile.${i}.zMm`]}
              aria-label={`Point ${i + 1} z`}
            />
            <TextInput
              label={`r (${lengthUnit})`}
              {...numberKeyboard()}
              value={row.r}
              onChange={(e) => edit(i, 'r', e.target.value)}
              error={errors[`wheelInsideProfile.${i}.rMm`]}
              aria-label={`Point ${i + 1} r`}
            />
            <Button
              variant="quiet"
              onClick={() => onChange(shownRows.filter((_, j) => j !== i))}
              aria-label={`Remove point ${i + 1}`}
            >
              ✕
            </Button>
          </li>
        ))}
      </ol>
      <div>
        <Button variant="secondary" onClick={() => onChange([...shownRows, { z: '', r: '' }])} disabled={shownRows.length >= 40}>
          Add a point
        </Button>
      </div>
    </fieldset>
  );
}
