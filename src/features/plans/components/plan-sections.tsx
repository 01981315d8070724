import type { ReactNode } from 'react';
import type { PlanView } from '@shared/schemas/plans';
import type { CarBrakes, CornerSource } from '@shared/fitment/plan';
import { costRouteLabels, costRoutes } from '@shared/schemas/enums';
import { axleWord, fastenerKindLabels, lubricationLabels, machiningComponentLabels } from '@shared/schemas/swap-data-labels';
import { AdhesionChart } from '../../../components/adhesion-chart';
import { BalanceShiftNote } from '../../../components/balance-shift-note';
import { formatMoney } from '@shared/money';
import { round, useUnits } from '../../../lib/units';

const pct = (share: number) => `${round(share * 100, 1)} %`;
const titleOf = (plan: PlanView, slug: string | null) => plan.swaps.find((s) => s.slug === slug)?.title ?? slug;

export function PlanSection({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <section id={id} aria-labelledby={`${id}-h`} className="min-w-0 scroll-mt-20">
      <h2 id={`${id}-h`} className="mb-3 border-b border-ink/15 pb-1 text-lg font-extrabold text-ink">
        {title}
      </h2>
      {children}
    </section>
  );
}

function Table({ caption, head, rows }: { caption: string; head: string[]; rows: ReactNode[][] }) {
  return (
    <div className="overflow-x-auto">
      <table className="tabular w-full border-collapse text-left text-sm">
        <caption className="sr-only">{caption}</caption>
        <thead>
          <tr className="border-b border-graphite/20 text-xs uppercase tracking-wide text-graphite-soft">
            {head.map((h) => (
              <th key={h} scope="col" className="px-2 py-2 font-bold">
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((r, i) => (
            <tr key={i} className="print-break-avoid border-b border-graphite/10 align-top">
              {r.map((c, j) => (
                <td key={j} className="px-2 py-1.5">
                  {c}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

const sourceWords = (source: CornerSource) => (source.kind === 'stock' ? 'stock' : source.title);

function CornerList({ label, brakes }: { label: string; brakes: CarBrakes }) {
  return (
    <div className="rounded-lg border border-graphite/15 p-3 text-sm">
      <p className="font-bold text-graphite">{label}</p>
      <ul className="mt-1 grid gap-0.5 text-graphite">
        {(['front', 'rear'] as const).map((axle) => (
          <li key={axle}>
            <span className="font-bold">{axleWord(axle)}:</span> {sourceWords(brakes[axle].source)}
          </li>
        ))}
      </ul>
    </div>
  );
}

export function PlanBrakes({ plan }: { plan: PlanView }) {
  const b = plan.brakes;
  const d = b.distribution;
  const startLabel = plan.car ? `${plan.car.nickname} as it is` : 'The car as it is (stock)';
  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-4" data-plan-brakes>
      <p className="tabular text-sm text-graphite">
        Front share of brake torque at equal line pressure: <span className="font-bold">{pct(b.frontShareAsIs)}</span> as it is →{' '}
        <span className="font-bold">{pct(b.frontSharePlanned)}</span> as planned.
      </p>
      <BalanceShiftNote shift={b.shift} />
      <div className="grid gap-3 sm:grid-cols-2">
        <CornerList label={startLabel} brakes={b.asIs} />
        <CornerList label="As planned" brakes={b.planned} />
      </div>
      {d ? (
        <div className="grid gap-3">
          <div className="rounded-lg border border-ink/30 bg-ink-faint/50 p-3" data-plan-lock-order>
            <p className="text-sm font-bold text-graphite">Which axle locks first</p>
            <p className="mt-1 font-bold text-graphite">{d.summary}</p>
            <p className="mt-1 text-xs text-graphite-soft">
              An estimate from {b.vehicleSource === 'car' ? 'your car’s own figures' : 'the chassis’ stock figures'}, not a
              measurement. Fronts locking first is the stable order.
            </p>
          </div>
          <Table
            caption="Deceleration from which the rear locks first"
            head={['Load', 'Rear locks first, as it is', 'As planned']}
            rows={d.before.states.map((s) => {
              const after = d.after?.states.find((a) => a.state === s.state);
              const at = (z: number | null | undefined) =>
                z == null ? `not up to ${round(d.maxDecelerationG, 2)} g` : `above ${round(z, 2)} g`;
              return [s.state === 'laden' ? 'Laden' : 'Unladen', at(s.rearFirstFromG), at(after?.rearFirstFromG)];
            })}
          />
          <AdhesionChart
            title="Unladen car"
            maxG={d.maxDecelerationG}
            sets={[
              { stage: 'before', label: 'As it is', analysis: d.before.states[0]! },
              ...(d.after ? [{ stage: 'after' as const, label: 'As planned', analysis: d.after.states[0]! }] : []),
            ]}
          />
          <details className="text-xs text-graphite-soft print:hidden">
            <summary className="cursor-pointer font-bold text-graphite">Assumptions and sources</summary>
            <ul className="mt-1 list-disc pl-5">
              {[...d.assumptions, ...d.rules, `Sources: ${d.reference.provenance}`].map((a) => (
                <li key={a}>{a}</li>
              ))}
            </ul>
          </details>
        </div>
      ) : (
        <p className="text-sm text-graphite-soft">
          The lock order needs the car’s masses, weight split and centre of gravity; this chassis has none on record. Add your
          car’s figures in My cars to see it.
        </p>
      )}
      {b.overridden.length > 0 && (
        <p className="text-sm font-bold text-oxide">
          {b.overridden.map((o) => `${titleOf(plan, o.by)} replaces ${titleOf(plan, o.slug)} on the ${o.axle} axle`).join('; ')}.
        </p>
      )}
    </div>
  );
}

export function PlanWheels({ plan }: { plan: PlanView }) {
  const { length } = useUnits();
  const w = plan.wheels;
  const spacerRows = (['front', 'rear'] as const).flatMap((axle) =>
    w.spacers[axle].map((s) => [
      axleWord(axle),
      length(s.thicknessMm),
      `${s.mounting === 'bolt_on' ? 'Bolt-on' : 'Slip-on'}${s.hubCentric ? ', hub-centric' : ''}`,
      s.quantity,
    ]),
  );
  const boltRows = (['front', 'rear'] as const).flatMap((axle) =>
    w.wheelBolts[axle].map((b) => [
      axleWord(axle),
      b.label,
      b.thread || '—',
      b.lengthMm ? length(b.lengthMm, 0) : '—',
      b.quantity ?? '—',
    ]),
  );
  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-3 text-sm" data-plan-wheels>
      <p className="text-graphite">
        {w.minDiameterIn === null ? (
          'No swap in the plan states a minimum wheel size.'
        ) : (
          <>
            The plan needs at least a <span className="font-bold">{w.minDiameterIn}″ wheel</span> (set by{' '}
            {titleOf(plan, w.minDiameterFrom)}).
          </>
        )}
      </p>
      {w.checks.length > 0 && plan.car && (
        <ul className="grid gap-1" aria-label="Your wheel against each swap">
          {w.checks.map((c) => (
            <li
              key={c.slug}
              data-verdict={c.summary.tone}
              className={`rounded-md border-l-4 px-3 py-2 ${c.summary.tone === 'pass' ? 'border-ink bg-ink-faint/60' : c.summary.tone === 'fail' ? 'border-oxide bg-oxide-soft' : 'border-brass bg-brass-soft/40'}`}
            >
              <span className="font-bold">
                {axleWord(c.axle)}, {titleOf(plan, c.slug)}:
              </span>{' '}
              {c.summary.text}
            </li>
          ))}
        </ul>
      )}
      {spacerRows.length > 0 && (
        <Table caption="Spacers per axle" head={['Axle', 'Thickness', 'Kind', 'Qty']} rows={spacerRows} />
      )}
      {boltRows.length > 0 && (
        <Table caption="Wheel bolts" head={['Axle', 'Wheel bolt', 'Thread', 'Length', 'Qty']} rows={boltRows} />
      )}
    </div>
  );
}

export function PlanParts({ plan }: { plan: PlanView }) {
  return (
    <Table
      caption="Parts for the whole plan"
      head={['Part', 'Front', 'Rear', 'Total']}
      rows={plan.parts.map((p) => [
        <span key="n">
          <span className="font-bold">{p.name}</span>
          {p.maker && <span className="text-graphite-soft"> · {p.maker}</span>}
        </span>,
        p.perAxle.front || '—',
        p.perAxle.rear || '—',
        <span key="t" className="font-bold">
          {p.total}
        </span>,
      ])}
    />
  );
}

export function PlanMachining({ plan }: { plan: PlanView }) {
  if (plan.machining.length === 0) return <p className="text-sm text-graphite">No machining in this plan.</p>;
  return (
    <ol className="grid gap-2 text-sm">
      {plan.machining.map((s) => (
        <li key={s.n} className="print-break-avoid flex gap-3">
          <span className="tabular w-6 shrink-0 font-extrabold text-ink">{s.n}.</span>
          <span>
            <span className="font-bold">
              {machiningComponentLabels[s.component]}, {s.operation}
            </span>{' '}
            — {s.where} ({axleWord(s.axle).toLowerCase()}, {s.required ? 'required' : 'optional'})
            {s.structural && <span className="ml-1 font-bold text-oxide">Structural: have it inspected.</span>}
            {s.notes && <span className="block text-graphite-soft">{s.notes}</span>}
          </span>
        </li>
      ))}
    </ol>
  );
}

export function PlanTorque({ plan }: { plan: PlanView }) {
  const { torque } = useUnits();
  return (
    <Table
      caption="Torque for every fastener of the plan"
      head={['Axle', 'Fastener', 'Thread', 'Torque', 'Lubrication', 'Notes']}
      rows={plan.torque.map((t) => [
        axleWord(t.axle),
        <span key="f">
          <span className="font-bold">{t.fastener.label}</span>
          <span className="block text-xs text-graphite-soft">{fastenerKindLabels[t.fastener.kind]}</span>
        </span>,
        t.fastener.thread || '—',
        <span key="nm" className="font-bold">
          {torque(t.nm)}
          {t.angleDeg ? ` + ${t.angleDeg}°` : ''}
        </span>,
        lubricationLabels[t.lubrication],
        [t.singleUse ? 'Single use: replace' : '', t.notes].filter(Boolean).join('. ') || '—',
      ])}
    />
  );
}

export function PlanCosts({ plan }: { plan: PlanView }) {
  const c = plan.costs;
  if (!c.currency)
    return <p className="text-sm text-graphite">The swaps price in different currencies, so they are not added up.</p>;
  const money = (v: number | null) => (v === null ? '—' : formatMoney(v, c.currency!, { whole: true }));
  const rows = costRoutes.map((route) => [
    <span key="r" className="font-bold">
      {costRouteLabels[route]}
    </span>,
    money(c.perAxle.front[route]),
    money(c.perAxle.rear[route]),
    <span key="t" className="font-extrabold" data-plan-total={route}>
      {money(c.totals[route])}
    </span>,
    route === 'new_kit' || !c.savings[route]
      ? '—'
      : `${money(c.savings[route]!.amountMinor)}${c.savings[route]!.percent === null ? '' : ` (${round(c.savings[route]!.percent!, 0)} %)`}`,
  ]);
  return (
    <div className="grid gap-2">
      <Table caption="Cost per route" head={['Route', 'Front', 'Rear', 'Whole plan', 'Saving against new kit']} rows={rows} />
      {c.missing.length > 0 && (
        <p className="text-xs text-graphite-soft">
          Not priced: {c.missing.map((m) => `${costRouteLabels[m.route].toLowerCase()} for ${titleOf(plan, m.slug)}`).join(', ')}{' '}
          — those totals stay open.
        </p>
      )}
    </div>
  );
}

export function PlanTimeAndTools({ plan }: { plan: PlanView }) {
  const t = plan.time;
  return (
    <div className="grid gap-3 text-sm sm:grid-cols-2">
      <div>
        <p className="font-bold text-graphite">Install time</p>
        <p className="text-graphite">
          {t.totalHours === null ? 'Not stated by the swaps.' : `About ${round(t.totalHours, 1)} hours in all`}
          {t.longest && `; the longest job is ${t.longest.title} (${round(t.longest.hours, 1)} h).`}
        </p>
        {t.unstated.length > 0 && (
          <p className="text-xs text-graphite-soft">
            No time stated for {t.unstated.map((slug) => titleOf(plan, slug)).join(', ')}.
          </p>
        )}
      </div>
      <div>
        <p className="font-bold text-graphite">Tools</p>
        <ul className="list-disc pl-5 text-graphite">
          {plan.tools.map((tool) => (
            <li key={tool.name}>{tool.name}</li>
          ))}
        </ul>
      </div>
    </div>
  );
}
