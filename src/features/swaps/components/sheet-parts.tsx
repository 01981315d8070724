import { Link } from 'react-router';
import type { SwapData } from '@shared/schemas/swap-data';
import { useUnits } from '../../../lib/units';
import { nmToLbfFt } from '@shared/fitment/units';
import { paths } from '../../../config/paths';
import { Badge } from '../../../components/ui/badge';
import { SheetSection, SpecTable } from './sheet-section';

const dash = <span className="text-graphite-soft">—</span>;
const list = (items: string[]) => (items.length ? items.join(', ') : dash);

export function PartsSection({ parts }: { parts: SwapData['parts'] }) {
  return (
    <SheetSection id="parts" title="Parts">
      <SpecTable
        caption="Parts of this swap"
        head={['Role', 'Part', 'Part numbers', 'Came on', 'Qty', 'Notes']}
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
      <div className="rounded-lg border border-ink/10 bg-paper-card p-4">
        <p className="font-extrabold text-graphite">
          {adapter.name}
          {adapter.maker && <span className="font-normal text-graphite-soft"> · {adapter.maker}</span>}
        </p>
        {adapter.partNumber && <p className="font-mono text-sm">{adapter.partNumber}</p>}
        {adapter.hardwareIncluded.length > 0 && (
          <>
            <p className="mt-3 text-sm font-bold">Hardware included</p>
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

export function ShimsSpacersSection({ data }: { data: SwapData }) {
  const { length } = useUnits();
  return (
    <SheetSection id="shims" title="Shims and spacers">
      <div className="grid grid-cols-1 gap-4 md:grid-cols-2">
        <div>
          <h3 className="mb-1 text-sm font-bold">Centring shims (adapter to caliper)</h3>
          {data.shims.length === 0 ? (
            <p className="text-sm text-graphite-soft">None needed.</p>
          ) : (
            <SpecTable
              caption="Centring shims"
              head={['Where', 'Thickness', 'Qty']}
              rows={data.shims.map((s) => [s.location, length(s.thicknessMm, 2), s.quantity])}
            />
          )}
          {data.shimTargetMm !== null && (
            <p className="mt-1 text-xs text-graphite-soft">
              Measured centring gap: {length(data.shimTargetMm, 2)} per mounting point.
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
              head={['Thickness', 'Type', 'Qty', 'Notes']}
              rows={data.spacers.map((s) => [
                length(s.thicknessMm),
                `${s.hubCentric ? 'Hub-centric' : 'Not hub-centric'}, ${s.mounting === 'bolt_on' ? 'bolt-on' : 'slip-on'}`,
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
        head={['Diameter', 'Thickness', 'Type', 'Part number', 'Notes']}
        rows={rotors.map((r) => [
          <span className="font-bold">{length(r.diameterMm, 0)}</span>,
          length(r.thicknessMm),
          r.vented ? 'Vented' : 'Solid',
          <span className="font-mono text-xs">{r.partNumber || '—'}</span>,
          r.notes || dash,
        ])}
      />
    </SheetSection>
  );
}

const operationLabels = { grind: 'Grind', machine: 'Machine', drill: 'Drill', trim: 'Trim' } as const;

export function MachiningSection({ steps }: { steps: SwapData['machining'] }) {
  return (
    <SheetSection id="machining" title="Machining and fabrication">
      {steps.length === 0 ? (
        <p className="text-sm text-graphite">Bolt-on: no cutting, grinding or drilling.</p>
      ) : (
        <ol className="space-y-2">
          {steps.map((s, i) => (
            <li key={i} className="flex gap-3 rounded-lg border border-ink/10 bg-paper-card p-3 print:p-1.5">
              <span className="tabular flex h-7 w-7 shrink-0 items-center justify-center rounded-full bg-ink text-sm font-bold text-paper">
                {i + 1}
              </span>
              <div>
                <p className="font-bold">
                  {operationLabels[s.operation]}: {s.where}{' '}
                  {s.required ? <Badge tone="oxide">required</Badge> : <Badge tone="plain">optional</Badge>}
                </p>
                {s.notes && <p className="text-sm text-graphite">{s.notes}</p>}
              </div>
            </li>
          ))}
        </ol>
      )}
    </SheetSection>
  );
}

export function TorqueSection({ torque }: { torque: SwapData['torque'] }) {
  const { system } = useUnits();
  const primary = (nm: number) => (system === 'metric' ? `${nm} N·m` : `${Math.round(nmToLbfFt(nm))} lbf·ft`);
  const secondary = (nm: number) => (system === 'metric' ? `${Math.round(nmToLbfFt(nm))} lbf·ft` : `${nm} N·m`);
  return (
    <SheetSection id="torque" title="Torque specs">
      {torque.length === 0 ? (
        <p className="text-sm text-oxide">No torque figures recorded. Use the manufacturer’s values for every fastener.</p>
      ) : (
        <SpecTable
          caption="Torque specs"
          head={['Fastener', 'Torque', system === 'metric' ? 'lbf·ft' : 'N·m', 'Notes']}
          rows={torque.map((t) => [
            t.fastener,
            <span className="font-extrabold">{primary(t.nm)}</span>,
            secondary(t.nm),
            t.notes || dash,
          ])}
        />
      )}
    </SheetSection>
  );
}
