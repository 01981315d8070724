import { barToPsi, inToMm, kgToLb, lbToKg, lbfFtToNm, mmToIn, nmToLbfFt, psiToBar } from '@shared/fitment/units';
import type { UnitSystem } from '@shared/schemas/enums';
import { listItems, readNumber } from './number-text';

// Typed figures and the units toggle: a text in one system re-expressed in the other. The record
// form holds metric text and derives what an input shows; smaller forms hold what was typed and
// convert it when the toggle flips (use-typed-in-units.ts). Either way a typed figure keeps its
// meaning: 0.4 in stays 10.16 mm.

export type Quantity = 'length' | 'torque' | 'pressure' | 'mass';

const unitNames: Record<Quantity, Record<UnitSystem, string>> = {
  length: { metric: 'mm', imperial: 'in' },
  torque: { metric: 'N·m', imperial: 'lbf·ft' },
  pressure: { metric: 'bar', imperial: 'psi' },
  mass: { metric: 'kg', imperial: 'lb' },
};
const toImperial: Record<Quantity, (v: number) => number> = {
  length: mmToIn,
  torque: nmToLbfFt,
  pressure: barToPsi,
  mass: kgToLb,
};
const fromImperial: Record<Quantity, (v: number) => number> = {
  length: inToMm,
  torque: lbfFtToNm,
  pressure: psiToBar,
  mass: lbToKg,
};
// Shown: 0.0001 in, 0.01 lbf·ft, 0.01 psi, 0.01 lb. Held: 0.0001 of the metric unit, fine enough that a
// value typed in imperial (to the shown places) reads back exactly as typed.
const shownPlaces: Record<Quantity, number> = { length: 4, torque: 2, pressure: 2, mass: 2 };
const heldPlaces = 4;

export const unitOf = (q: Quantity, system: UnitSystem) => unitNames[q][system];

const fixed = (v: number, places: number) => {
  const r = Number(v.toFixed(places));
  return String(Object.is(r, -0) ? 0 : r);
};

function convertText(text: string, convert: (v: number) => number, places: number): string {
  const v = readNumber(text);
  // empty stays empty; unreadable text is kept as typed so the schema names the field
  if (v === undefined || !Number.isFinite(v)) return v === undefined ? '' : text;
  return fixed(convert(v), places);
}

/** The text an input shows for a held metric value. */
export function shownText(held: string, q: Quantity, system: UnitSystem): string {
  return system === 'metric' ? held : convertText(held, toImperial[q], shownPlaces[q]);
}

/** The metric text held for what was typed in the chosen system. */
export function heldText(typed: string, q: Quantity, system: UnitSystem): string {
  return system === 'metric' ? typed : convertText(typed, fromImperial[q], heldPlaces);
}

/** The same for a list of lengths (piston diameters). */
export function shownListText(held: string, q: Quantity, system: UnitSystem): string {
  return system === 'metric'
    ? held
    : listItems(held)
        .map((p) => shownText(p, q, system))
        .join('; ');
}
export function heldListText(typed: string, q: Quantity, system: UnitSystem): string {
  return system === 'metric'
    ? typed
    : listItems(typed)
        .map((p) => heldText(p, q, system))
        .join('; ');
}

/** A figure typed in `from` re-expressed in `to` (unchanged when they are the same). */
export function textInSystem(text: string, q: Quantity, from: UnitSystem, to: UnitSystem): string {
  if (from === to) return text;
  return to === 'imperial' ? shownText(text, q, 'imperial') : heldText(text, q, 'imperial');
}
