import { useState } from 'react';
import { inputClass } from '../../../components/ui/field';
import { Button } from '../../../components/ui/button';
import { useUnits } from '../../../lib/units';
import { toCanonical, toDisplay, unitLabel, type CalcParams } from './calc-params';
import { numberKeyboard } from '../../../lib/number-text';

/** One (z, r) row as typed, kept in the URL in mm: `z_r`. */
export type PointRow = { z: string; r: string };

export const decodeRow = (entry: string): PointRow => {
  const [z = '', r = ''] = entry.split('_');
  return { z, r };
};
const encodeRow = (row: PointRow) => `${row.z}_${row.r}`;

/** Typed text to what a number parser reads: a typographic minus or dash becomes "-", the separator of rows is dropped. */
const normalise = (text: string) => text.replace(/[\u2212\u2012\u2013]/g, '-').replace(/_/g, '');

/** A number typed with a decimal point or comma; null when empty, NaN when not a number. */
export function readNumber(text: string): number | null {
  const trimmed = normalise(text).trim().replace(',', '.');
  if (trimmed === '') return null;
  return /^[-+]?(\d+\.?\d*|\.\d+)$/.test(trimmed) ? Number(trimmed) : NaN;
}

export function readRows(params: CalcParams, name: string, least: number): PointRow[] {
  const rows = params.getAll(name).map(decodeRow);
  while (rows.length < least) rows.push({ z: '', r: '' });
  return rows;
}

type PointListProps = {
  params: CalcParams;
  /** the query key holding the rows */
  name: string;
  /** "Caliper point", "Wheel point" */
  noun: string;
  least: number;
  errors: Record<number, string>;
  zHint: string;
  rHint: string;
};

/** Rows of (z, r) in the chosen units; z takes a sign, so its field opens the full keyboard on a phone. */
export function PointList({ params, name, noun, least, errors, zHint, rHint }: PointListProps) {
  const { system } = useUnits();
  const rows = readRows(params, name, least);
  const unit = unitLabel('length', system);
  const save = (next: PointRow[]) => params.setAll(name, next.map(encodeRow));
  // Read the rows again at the moment of the edit: a second keystroke may come before the page has drawn the first.
  const change = (i: number, patch: Partial<PointRow>) =>
    save(readRows(params, name, least).map((row, j) => (j === i ? { ...row, ...patch } : row)));
  const hintId = `${name}-hint`;
  return (
    <div className="grid gap-2">
      <p id={hintId} className="text-xs text-graphite-soft">
        <span className="font-bold text-graphite">z</span> {zHint} · <span className="font-bold text-graphite">r</span> {rHint}
      </p>
      <div aria-hidden className="grid grid-cols-[2rem_1fr_1fr_5.5rem] gap-2 text-xs font-bold text-graphite">
        <span>#</span>
        <span>z ({unit})</span>
        <span>r ({unit})</span>
        <span />
      </div>
      <ol className="grid gap-2" aria-label={`${noun}s`}>
        {rows.map((row, i) => (
          <li key={i} className="grid grid-cols-[2rem_1fr_1fr_5.5rem] items-start gap-2">
            <span className="tabular pt-2 text-sm font-bold text-graphite-soft">{i + 1}</span>
            <LengthCell
              label={`${noun} ${i + 1} z (${unit})`}
              value={row.z}
              signed
              invalid={Boolean(errors[i])}
              describedBy={errors[i] ? `${name}-${i}-error` : hintId}
              onChange={(z) => change(i, { z })}
            />
            <LengthCell
              label={`${noun} ${i + 1} r (${unit})`}
              value={row.r}
              invalid={Boolean(errors[i])}
              describedBy={errors[i] ? `${name}-${i}-error` : hintId}
              onChange={(r) => change(i, { r })}
            />
            <Button
              variant="quiet"
              className="px-2 print:hidden"
              aria-label={`Remove ${noun.toLowerCase()} ${i + 1}`}
              disabled={rows.length <= least}
              onClick={() => save(readRows(params, name, least).filter((_, j) => j !== i))}
            >
              Remove
            </Button>
            {errors[i] && (
              <p id={`${name}-${i}-error`} role="alert" className="col-span-4 text-sm font-semibold text-oxide">
                {noun} {i + 1}: {errors[i]}
              </p>
            )}
          </li>
        ))}
      </ol>
      <div className="print:hidden">
        <Button variant="secondary" onClick={() => save([...readRows(params, name, least), { z: '', r: '' }])}>
          Add a point
        </Button>
      </div>
    </div>
  );
}

type LengthCellProps = {
  label: string;
  value: string;
  signed?: boolean;
  invalid: boolean;
  describedBy: string;
  onChange: (canonical: string) => void;
};

/** A length typed in the chosen units and kept in mm; what the person typed stays while it still means the stored value. */
function LengthCell({ label, value, signed = false, invalid, describedBy, onChange }: LengthCellProps) {
  const { system } = useUnits();
  const [draft, setDraft] = useState<{ text: string; canonical: string; system: string } | null>(null);
  const shown = draft && draft.canonical === value && draft.system === system ? draft.text : toDisplay(value, 'length', system);
  return (
    <input
      aria-label={label}
      aria-invalid={invalid}
      aria-describedby={describedBy}
      className={`${inputClass} tabular min-w-0 px-2`}
      {...numberKeyboard(signed)}
      autoComplete="off"
      spellCheck={false}
      value={shown}
      onChange={(e) => {
        const text = normalise(e.target.value);
        const canonical = toCanonical(text, 'length', system);
        setDraft({ text: e.target.value, canonical, system });
        onChange(canonical);
      }}
    />
  );
}
