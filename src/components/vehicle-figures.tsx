import type { RearValve, VehicleData } from '@shared/schemas/vehicle';
import { round, useUnits } from '../lib/units';

type Units = ReturnType<typeof useUnits>;

export function rearValveText(valve: RearValve, units: Pick<Units, 'pressure'>): string {
  switch (valve.kind) {
    case 'none':
      return 'no rear valve';
    case 'proportioning':
      return `proportioning valve, knee ${units.pressure(valve.kneeBar)}, slope ${valve.slope}`;
    case 'load-sensing':
      return `load-sensing valve, knee ${units.pressure(valve.kneeBarUnladen)} unladen and ${units.pressure(valve.kneeBarLaden)} laden, slope ${valve.slope}`;
    case 'electronic':
      return 'electronic distribution (with ABS)';
  }
}

/** The figures a brake-distribution analysis rests on, as label/value rows. */
export function vehicleRows(v: VehicleData, units: Units): [string, string][] {
  const state = (s: VehicleData['unladen']) =>
    `${units.mass(s.massKg)} · ${round(s.frontStaticFraction * 100, 1)} % front · centre of gravity ${units.length(s.cgHeightMm, 0)}`;
  const radius = v.tyreLoadedRadiusMm;
  return [
    ['Unladen', state(v.unladen)],
    ['Laden', v.laden ? state(v.laden) : 'not given'],
    ['Wheelbase', units.length(v.wheelbaseMm, 0)],
    [
      'Tyre loaded radius',
      radius.front === radius.rear
        ? units.length(radius.front, 0)
        : `front ${units.length(radius.front, 0)}, rear ${units.length(radius.rear, 0)}`,
    ],
    ['Rear valve', rearValveText(v.rearValve, units)],
  ];
}

/** A compact list of a car's figures; `basis` says where they come from. */
export function VehicleFiguresList({ vehicle, className = '' }: { vehicle: VehicleData; className?: string }) {
  const units = useUnits();
  return (
    <div className={className}>
      <dl className="tabular grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 text-xs">
        {vehicleRows(vehicle, units).map(([label, value]) => (
          <div key={label} className="contents">
            <dt className="text-graphite-soft">{label}</dt>
            <dd className="font-semibold text-graphite">{value}</dd>
          </div>
        ))}
      </dl>
      {vehicle.basis && <p className="mt-1 text-xs text-graphite-soft">{vehicle.basis}</p>}
    </div>
  );
}
