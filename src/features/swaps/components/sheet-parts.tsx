import { Link } from 'react-router';
import { isStructural, type SwapData } from '@shared/schemas/swap-data';
import {
  fastenerKindLabels,
  lubricationLabels,
  machiningComponentLabels,
  shimJointLabels,
  wheelOutcomeLabels,
} from '@shared/schemas/swap-data-labels';
import { useUnits } from '../../../lib/units';
import { nmToLbfFt } from '@shared/fitment/units';
import { paths } from '../../../config/paths';
import { Badge } from '../../../components/ui/badge';
import { emptyCell, SheetSection, SpecTable } from './sheet-section';

const dash = emptyCell;
const list = (items: string[]) => (items.length ? items.join(', ') : dash);

export function PartsSection({ parts }: { parts: SwapData['parts'] }) {
  return (
    <SheetSection id="parts" title="Parts">
      <SpecTable
        caption="Parts of this swap"
        head={['Role', 'Part', 'Part numbers', 'Came on', 'Qty', 'Notes']}
        screenOnly={[3]}
        rows={parts.map((p) => [
          <span className="font-bold">{p.role}</span>,
          p.partId ? (
            <Link to={paths.part(p.partId)} className="font-bold text-ink underline decoration-brass underline-offset-2">
              {p.name}
            </Link>
          ) : (
            <span>
              {p.name} <Badge tone="brass">new part</Badge>
            </span>
          ),
          <span className="font-mono text-xs">{list(p.partNumbers)}</span>,
          list(p.cameOn),
          p.quantity,
          p.notes || dash,
        ])}
      />
    </SheetSection>
  );
}

export function AdapterSection({ adapter }: { adapter: NonNullable<SwapData['adapter']> }) {
  return (
    <SheetSection id="adapter" title="Adapter">
      <div className="rounded-lg border border-ink/10 bg-paper-card p-4 print:px-2 print:py-1">
        <p className="font-extrabold text-graphite">
          {adapter.name}
          {adapter.maker && <span className="font-normal text-graphite-soft"> · {adapter.maker}</span>}
        </p>
        {adapter.partNumber && <p className="font-mono text-sm">{adapter.partNumber}</p>}
        {adapter.hardwareIncluded.length > 0 && (
          <>
            <p className="mt-3 text-sm font-bold print:mt-1">Hardware included</p>
            <ul className="list-disc pl-5 text-sm">
              {adapter.hardwareIncluded.map((h) => (
                <li key={h}>{h}</li>
              ))}
            </ul>
          </>
        )}
        {adapter.notes && <p className="mt-2 text-sm text-graphite">{adapter.notes}</p>}
      </div>
    </SheetSection>
  );
}

/** left and right calipers that differ only in name share one row */
function sameExceptName<T extends { name: string }>(rows: T[]): { row: T; names: string[] }[] {
  const groups = new Map<string, { row: T; names: string[] }>();
  for (const row of rows) {
    const { name: _name, ...rest } = row;
    const key = JSON.stringify(rest);
    const group = groups.get(key);
    if (group) group.names.push(row.name);
    else groups.set(key, { row, names: [row.name] });
  }
  return [...groups.values()];
}

export function CalipersSection({ calipers }: { calipers: SwapData['calipers'] }) {
  const { length } = useUnits();
  const pistons = (c: SwapData['calipers'][number], side: 'inboard' | 'outboard') =>
    c.pistons
      .filter((p) => p.side === side)
      .map((p) => length(p.diameterMm, 0))
      .join(' + ');
  return (
    <SheetSection id="calipers" title="Calipers">
      <SpecTable
        caption="Calipers as fitted"
        head={['Axle', 'Caliper', 'Pistons', 'Mounting', 'Made for rotor', 'Bleed screw']}
        rows={sameExceptName(calipers).map(({ row: c, names }) => [
          c.axle === 'front' ? 'Front' : 'Rear',
          <span className="font-bold">{names.join(' · ')}</span>,
          c.type === 'fixed' ? `${pistons(c, 'inboard')} each side (fixed)` : `${pistons(c, 'inboard')} (floating)`,
          `${c.mount.type === 'radial' ? 'Radial' : 'Axial'}${c.mount.spacingMm ? `, ${length(c.mount.spacingMm, 0)} centres` : ''}${c.mount.thread ? `, ${c.mount.thread}` : ''}`,
          c.designRotor.diameterMm
            ? `${length(c.designRotor.diameterMm, 0)}${c.designRotor.thicknessMinMm ? ` × ${length(c.designRotor.thicknessMinMm, 0)}–${length(c.designRotor.thicknessMaxMm ?? c.designRotor.thicknessMinMm, 0)}` : ''}`
            : dash,
          c.bleedScrewWhenFitted === 'bottom' ? (
            <Badge tone="oxide">at the bottom</Badge>
          ) : c.bleedScrewWhenFitted === 'top' ? (
            'At the top'
          ) : (
            dash
          ),
        ])}
      />
    </SheetSection>
  );
}

const jointNouns = { bracket_to_knuckle: 'bracket-to-knuckle joint', caliper_to_bracket: 'caliper-to-bracket joint' } as const;

export function ShimsSpacersSection({ data }: { data: SwapData }) {
  const { length } = useUnits();
  const c = data.centring;
  const atJoint = c ? data.shims.filter((s) => s.joint === c.joint && s.direction === 'axial') : [];
  const perBolt = c ? atJoint.reduce((sum, s) => sum + s.thicknessMm * s.quantity, 0) / c.positions : 0;
  return (
    <SheetSection id="shims" title="Shims and spacers">
      <div className="grid grid-cols-1 gap-4 md:grid-cols-2">
        <div>
          <h3 className="mb-1 text-sm font-bold">Shims in the caliper mounting</h3>
          {data.shims.length === 0 ? (
            <p className="text-sm text-graphite-soft">None needed.</p>
          ) : (
            <SpecTable
              caption="Shims"
              head={['Joint', 'Moves the caliper', 'Thickness', 'Qty']}
              rows={data.shims.map((s) => [
                <span>
                  {shimJointLabels[s.joint]}
                  {s.notes && <span className="block text-xs text-graphite-soft">{s.notes}</span>}
                </span>,
                s.direction === 'axial' ? 'Along the axle (centres)' : 'Outward (lifts)',
                length(s.thicknessMm, 2),
                s.quantity,
              ])}
            />
          )}
          {c && (
            <p className="mt-1 text-xs text-graphite-soft">
              Measured centring gap {length(c.gapMm, 2)} per bolt at the {jointNouns[c.joint]} ({c.positions} bolt positions); the
              axial shims there add up to {length(perBolt, 2)} per bolt.
            </p>
          )}
        </div>
        <div>
          <h3 className="mb-1 text-sm font-bold">Wheel spacers (hub to wheel)</h3>
          {data.spacers.length === 0 ? (
            <p className="text-sm text-graphite-soft">None needed.</p>
          ) : (
            <SpecTable
              caption="Wheel spacers"
              head={['Axle', 'Thickness', 'Type', 'Qty', 'Notes']}
              rows={data.spacers.map((s) => [
                s.axle === 'front' ? 'Front' : 'Rear',
                length(s.thicknessMm),
                `${s.hubCentric ? 'Hub-centric' : 'Not hub-centric'}, ${s.mounting === 'bolt_on' ? 'bolt-on' : 'slip-on'}, ${s.material}`,
                s.quantity,
                s.notes || dash,
              ])}
            />
          )}
        </div>
      </div>
    </SheetSection>
  );
}

export function RotorsSection({ rotors }: { rotors: SwapData['rotors'] }) {
  const { length } = useUnits();
  return (
    <SheetSection id="rotors" title="Rotors">
      <SpecTable
        caption="Rotors"
        head={['Axle', 'Diameter × thickness', 'Type', 'Hat height', 'Part number', 'Notes']}
        rows={rotors.map((r) => [
          r.axle === 'front' ? 'Front' : 'Rear',
          <span>
            <span className="font-bold">
              {length(r.diameterMm, 0)} × {length(r.thicknessMm, 0)}
            </span>
            {r.minThicknessMm && <span className="block text-xs text-graphite-soft">min. {length(r.minThicknessMm, 1)}</span>}
          </span>,
          [
            r.vented ? 'Vented' : 'Solid',
            r.directional ? 'directional' : null,
            r.parkingDrumDiameterMm ? `${length(r.parkingDrumDiameterMm, 0)} drum in hat` : null,
          ]
            .filter(Boolean)
            .join(', '),
          r.hatHeightMm ? length(r.hatHeightMm, 0) : dash,
          r.partNumber ? <span className="font-mono text-xs">{r.partNumber}</span> : dash,
          r.notes || dash,
        ])}
      />
    </SheetSection>
  );
}

const operationLabels = { grind: 'Grind', machine: 'Machine', drill: 'Drill', trim: 'Trim' } as const;

export function MachiningSection({ steps }: { steps: SwapData['machining'] }) {
  const { length } = useUnits();
  return (
    <SheetSection id="machining" title="Machining and fabrication">
      {steps.length === 0 ? (
        <p className="text-sm text-graphite">Bolt-on: no cutting, grinding or drilling.</p>
      ) : (
        <ol className="space-y-2 print:space-y-0.5">
          {steps.map((s, i) => (
            <li
              key={i}
              className="flex gap-3 rounded-lg border border-ink/10 bg-paper-card p-3 print:gap-2 print:px-1.5 print:py-0.5"
            >
              <span className="tabular flex h-7 w-7 shrink-0 items-center justify-center rounded-full bg-ink text-sm font-bold text-paper print:h-5 print:w-5">
                {i + 1}
              </span>
              <div>
                <p className="font-bold">
                  {operationLabels[s.operation]} · {machiningComponentLabels[s.component].toLowerCase()}: {s.where}{' '}
                  {s.required ? <Badge tone="oxide">required</Badge> : <Badge tone="plain">optional</Badge>}{' '}
                  {isStructural(s) && <Badge tone="oxide">structural part</Badge>}
                </p>
                {s.amountMm && <p className="text-sm text-graphite">About {length(s.amountMm, 1)} removed.</p>}
                {s.notes && <p className="text-sm text-graphite">{s.notes}</p>}
              </div>
            </li>
          ))}
        </ol>
      )}
    </SheetSection>
  );
}

export function TorqueSection({ data }: { data: SwapData }) {
  const { system, length } = useUnits();
  const primary = (nm: number) => (system === 'metric' ? `${nm} N·m` : `${Math.round(nmToLbfFt(nm))} lbf·ft`);
  const secondary = (nm: number) => (system === 'metric' ? `${Math.round(nmToLbfFt(nm))} lbf·ft` : `${nm} N·m`);
  const fastener = new Map(data.fasteners.map((f) => [f.id, f]));
  return (
    <SheetSection id="torque" title="Torque specs">
      {data.torque.length === 0 ? (
        <p className="text-sm text-oxide">No torque figures recorded. Use the manufacturer’s values for every fastener.</p>
      ) : (
        <SpecTable
          caption="Torque specs"
          head={['Fastener', 'Thread', 'Torque', system === 'metric' ? 'lbf·ft' : 'N·m', 'Threads', 'Notes']}
          rows={data.torque.map((t) => {
            const f = fastener.get(t.fastenerId);
            return [
              <span>
                <span className="font-bold">{f?.label ?? t.fastenerId}</span>
                {f && <span className="block text-xs text-graphite-soft print:hidden">{fastenerKindLabels[f.kind]}</span>}
              </span>,
              f
                ? [f.thread, f.lengthMm ? `× ${length(f.lengthMm, 0)}` : '', f.propertyClass].filter(Boolean).join(' ') || dash
                : dash,
              <span className="whitespace-nowrap font-extrabold">
                {primary(t.nm)}
                {t.angleDeg ? ` + ${t.angleDeg}°` : ''}
              </span>,
              <span className="whitespace-nowrap">{secondary(t.nm)}</span>,
              <span className="print:whitespace-nowrap">{lubricationLabels[t.lubrication]}</span>,
              [t.singleUse ? 'Single use: fit new ones' : '', t.notes].filter(Boolean).join('. ') || dash,
            ];
          })}
        />
      )}
    </SheetSection>
  );
}

export function TestedWheelsList({ wheels }: { wheels: NonNullable<SwapData['wheel']>['testedWheels'] }) {
  const { length } = useUnits();
  return (
    <SpecTable
      caption="Wheels tried with this swap"
      head={['Wheel', 'Outcome', 'Barrel', 'Spokes', 'Where and how measured']}
      rows={wheels.map((w) => [
        <span>
          <span className="font-bold">
            {w.diameterIn}×{w.widthIn} ET{w.offsetMm}
          </span>
          {w.spacerMm > 0 && ` + ${length(w.spacerMm, 0)} spacer`}
          <span className="block text-xs text-graphite-soft">
            {[w.material !== 'not_stated' ? w.material : '', w.tyre, w.note].filter(Boolean).join(' · ')}
          </span>
        </span>,
        <Badge tone={w.outcome === 'does_not_fit' ? 'oxide' : w.outcome === 'fits' ? 'ink' : 'brass'}>
          {wheelOutcomeLabels[w.outcome]}
          {w.outcome === 'fits_with_change' && w.change ? `: ${w.change}` : ''}
        </Badge>,
        w.radialClearanceMm !== undefined ? length(w.radialClearanceMm) : dash,
        w.spokeClearanceMm !== undefined ? length(w.spokeClearanceMm) : dash,
        w.measuredWhere || dash,
      ])}
    />
  );
}
