import { useMemo } from 'react';
import type { SwapData } from '@shared/schemas/swap-data';
import { compareRevisions, type ChangeValue, type FieldChange, type RowChange, type TextChange } from '@shared/revision-changes';
import { kgToLb } from '@shared/fitment/units';
import { round, useUnits } from '../lib/units';
import { formatMoney } from '@shared/money';

type Revision = { data: SwapData; body: string };

/** Formats a change's value in the reader's units. */
export function useShowChangeValue() {
  const units = useUnits();
  const imperial = units.system === 'imperial';
  return (v: ChangeValue): string => {
    switch (v.kind) {
      case 'text':
        return v.text;
      case 'length':
        return units.length(v.mm, 2);
      case 'lengths':
        return v.mm.map((mm) => units.length(mm, 2)).join(' + ');
      case 'torque':
        return units.torque(v.nm);
      case 'pressure':
        return units.pressure(v.bar);
      case 'mass':
        return imperial ? `${round(kgToLb(v.kg), 1)} lb` : `${round(v.kg, 2)} kg`;
      case 'money':
        return formatMoney(v.minor, v.currency);
      case 'number':
        return v.unit === '″' || v.unit === '°'
          ? `${round(v.value, 2)}${v.unit}`
          : `${round(v.value, 3)}${v.unit ? ` ${v.unit}` : ''}`;
    }
  };
}

const stamps: Record<RowChange['change'], { word: string; look: string; row: string }> = {
  added: { word: 'Added', look: 'bg-ink text-paper', row: 'border-ink/25 bg-paper-card' },
  removed: {
    word: 'Removed',
    look: 'border border-graphite/40 text-graphite-soft',
    row: 'border-dashed border-graphite/30 bg-paper',
  },
  changed: { word: 'Changed', look: 'bg-brass-deep text-paper', row: 'border-brass/40 bg-paper-card' },
};

function Stamp({ change }: { change: RowChange['change'] }) {
  const s = stamps[change];
  return (
    <span
      className={`inline-block shrink-0 rounded-sm px-1.5 py-0.5 text-[0.7rem] font-extrabold uppercase tracking-wider ${s.look}`}
      data-change={change}
    >
      {s.word}
    </span>
  );
}

/** "Torque  was 110 N·m  now 120 N·m", one line on a wide screen, stacked on a phone. */
function ChangedField({ field, show }: { field: FieldChange; show: (v: ChangeValue) => string }) {
  return (
    <div className="grid gap-x-3 gap-y-0.5 py-1.5 sm:grid-cols-[minmax(9rem,14rem)_1fr]">
      <dt className="text-sm font-bold text-graphite-soft">{field.label}</dt>
      <dd className="flex flex-wrap items-baseline gap-x-2 gap-y-0.5 text-sm">
        <span className="text-graphite-soft">
          <span className="text-xs uppercase tracking-wide">was</span>{' '}
          <span className="tabular">{field.before ? show(field.before) : 'not given'}</span>
        </span>
        <svg viewBox="0 0 16 8" className="h-2 w-4 self-center text-brass" aria-hidden>
          <path d="M0 4h13M10 1l3 3-3 3" fill="none" stroke="currentColor" strokeWidth="1.5" />
        </svg>
        <span className="font-bold text-ink">
          <span className="text-xs font-semibold uppercase tracking-wide text-graphite-soft">now</span>{' '}
          <span className="tabular">{field.after ? show(field.after) : 'not given'}</span>
        </span>
      </dd>
    </div>
  );
}

function Row({ row, show }: { row: RowChange; show: (v: ChangeValue) => string }) {
  const s = stamps[row.change];
  return (
    <li className={`rounded-lg border p-3 ${s.row}`} data-row-change={row.change}>
      <div className="flex items-start gap-2">
        <Stamp change={row.change} />
        <p className="min-w-0">
          <span className={`font-bold ${row.change === 'removed' ? 'text-graphite-soft' : 'text-graphite'}`}>{row.name}</span>
          {row.kind && <span className="block text-xs font-semibold text-graphite-soft">{row.kind}</span>}
        </p>
      </div>
      {row.change === 'changed' ? (
        <dl className="mt-1 divide-y divide-graphite/10">
          {row.fields.map((f) => (
            <ChangedField key={f.label} field={f} show={show} />
          ))}
        </dl>
      ) : (
        row.fields.length > 0 && (
          <dl className={`mt-1.5 flex flex-wrap gap-x-4 gap-y-1 text-sm ${row.change === 'removed' ? 'text-graphite-soft' : ''}`}>
            {row.fields.map((f) => (
              <div key={f.label}>
                <dt className="inline text-graphite-soft">{f.label}:</dt>{' '}
                <dd className="tabular inline font-semibold">{show((f.after ?? f.before)!)}</dd>
              </div>
            ))}
          </dl>
        )
      )}
    </li>
  );
}

function WriteUp({ changes }: { changes: TextChange[] }) {
  return (
    <ul className="space-y-3">
      {changes.map((c, i) => (
        <li key={i} className="rounded-lg border border-graphite/15 bg-paper-card p-3" data-row-change={c.change}>
          <p className="mb-1">
            <Stamp change={c.change === 'reworded' ? 'changed' : c.change} />{' '}
            <span className="text-sm font-bold text-graphite-soft">
              {c.change === 'reworded' ? 'Paragraph reworded' : c.change === 'added' ? 'New paragraph' : 'Paragraph taken out'}
            </span>
          </p>
          {c.change === 'reworded' ? (
            <p className="whitespace-pre-wrap text-sm leading-relaxed">
              {c.words.map((w, j) =>
                w.change === 'same' ? (
                  <span key={j}>{w.text}</span>
                ) : w.change === 'added' ? (
                  <ins key={j} className="rounded-sm bg-brass-soft px-0.5 font-semibold text-graphite no-underline">
                    {w.text}
                  </ins>
                ) : (
                  <del key={j} className="text-graphite-soft decoration-oxide decoration-2">
                    {w.text}
                  </del>
                ),
              )}
            </p>
          ) : (
            <p className={`whitespace-pre-wrap text-sm leading-relaxed ${c.change === 'removed' ? 'text-graphite-soft' : ''}`}>
              {c.text}
            </p>
          )}
        </li>
      ))}
    </ul>
  );
}

/**
 * "What changed" between two revisions, section by section in the sheet's words: each list row is
 * paired with the same fastener, part, tested wheel or cost line in the other revision.
 */
export function RevisionChanges({
  before,
  after,
  idPrefix = 'changes',
}: {
  before: Revision;
  after: Revision;
  idPrefix?: string;
}) {
  const show = useShowChangeValue();
  const changes = useMemo(() => compareRevisions(before, after), [before, after]);
  const count = changes.sections.reduce((n, s) => n + s.rows.length, 0);
  if (count === 0 && changes.writeUp.length === 0)
    return <p className="rounded-lg bg-paper-card p-4 text-graphite">Nothing in the record or the write-up changed.</p>;
  return (
    <div className="space-y-6 break-words" data-testid="revision-changes">
      <p className="text-sm text-graphite-soft">
        {count > 0 &&
          `${count} ${count === 1 ? 'change' : 'changes'} in ${changes.sections.length} ${changes.sections.length === 1 ? 'section' : 'sections'}`}
        {count > 0 && changes.writeUp.length > 0 && ', and '}
        {changes.writeUp.length > 0 &&
          `${changes.writeUp.length} ${changes.writeUp.length === 1 ? 'paragraph' : 'paragraphs'} of the write-up`}
        .
      </p>
      {changes.sections.map((s) => (
        <section key={s.section} aria-labelledby={`${idPrefix}-${s.section}`} className="border-l-4 border-brass pl-3 sm:pl-4">
          <h3 id={`${idPrefix}-${s.section}`} className="mb-2 text-lg font-extrabold text-ink">
            {s.title}
          </h3>
          <ul className="space-y-2">
            {s.rows.map((r, i) => (
              <Row key={`${r.change}-${r.name}-${i}`} row={r} show={show} />
            ))}
          </ul>
        </section>
      ))}
      {changes.writeUp.length > 0 && (
        <section aria-labelledby={`${idPrefix}-write-up`} className="border-l-4 border-brass pl-3 sm:pl-4">
          <h3 id={`${idPrefix}-write-up`} className="mb-2 text-lg font-extrabold text-ink">
            Write-up
          </h3>
          <WriteUp changes={changes.writeUp} />
        </section>
      )}
    </div>
  );
}
