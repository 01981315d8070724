import { get, set, type FieldErrors } from 'react-hook-form';
import type { z } from 'zod';
import {
  adapterSchema,
  brakeFiguresSchema,
  caliperSchema,
  centringSchema,
  costLineSchema,
  fastenerSchema,
  machiningStepSchema,
  parkingBrakeSchema,
  rotorSchema,
  shimSchema,
  spacerSchema,
  swapDataSchema,
  swapPartSchema,
  torqueSpecSchema,
  wheelRequirementSchema,
  SWAP_DATA_VERSION,
  type BrakeCorner,
  type SwapData,
  type caliperTypes,
  type drumShoeTypes,
  type FastenerKind,
  type lubrications,
  type MachiningComponent,
  type mountTypes,
  type parkingBrakeTypes,
  type seatTypes,
  type shimDirections,
  type shimJoints,
  type spacerMaterials,
  type wheelMaterials,
  type WheelOutcome,
} from '@shared/schemas/swap-data';
import {
  createSubmissionSchema,
  type CreateSubmission,
  type IncompleteRow,
  type IncompleteRowList,
  type NewChassis,
} from '@shared/schemas/submissions';
import type { Axle, Category, CostRoute, PartKind } from '@shared/schemas/enums';
import { parseThread } from '@shared/fitment/threads';
import type { ChassisView } from '@shared/schemas/views';
import { numberList, readNumber } from '../../../lib/number-text';

export { numberList };

// What the inputs hold. Numbers stay text while typed (a half-typed "12," must not vanish),
// lists of words are one text box; toPayload turns it into the shared schema's shape, and the
// field names mirror the schema's paths so client and server errors land on the same field.

type Num = string;

export type CornerValues = {
  kind: 'disc' | 'drum';
  pistonsPerSideMm: string;
  rotorDiameterMm: Num;
  padHeightMm: Num;
  wheelCylinderBoreMm: Num;
  drumDiameterMm: Num;
  shoeType: (typeof drumShoeTypes)[number];
  brakeFactor: Num;
};

type Of<T extends readonly string[]> = T[number];

export type CaliperValues = {
  axle: Axle;
  name: string;
  type: Of<typeof caliperTypes>;
  inboardMm: string;
  outboardMm: string;
  mountType: Of<typeof mountTypes>;
  mountSpacingMm: Num;
  mountThread: string;
  designDiameterMm: Num;
  designThicknessMinMm: Num;
  designThicknessMaxMm: Num;
  padHeightMm: Num;
  bleedScrewWhenFitted: '' | 'top' | 'bottom';
  notes: string;
};

export type RotorValues = {
  axle: Axle;
  diameterMm: Num;
  thicknessMm: Num;
  minThicknessMm: Num;
  hatHeightMm: Num;
  frictionRingInnerDiameterMm: Num;
  centreBoreMm: Num;
  vented: boolean;
  directional: boolean;
  massKg: Num;
  parkingDrumDiameterMm: Num;
  partNumber: string;
  notes: string;
};

/** one row of the form: a fastener of the record and its torque (a fastener without a value gets no torque row) */
export type FastenerValues = {
  id: string;
  kind: FastenerKind;
  label: string;
  thread: string;
  lengthMm: Num;
  propertyClass: string;
  quantity: Num;
  nm: Num;
  lubrication: Of<typeof lubrications>;
  angleDeg: Num;
  singleUse: boolean;
  notes: string;
};

export type TestedWheelValues = {
  diameterIn: Num;
  widthIn: Num;
  offsetMm: Num;
  spacerMm: Num;
  outcome: WheelOutcome;
  change: string;
  material: Of<typeof wheelMaterials>;
  centreBoreMm: Num;
  seat: Of<typeof seatTypes>;
  tyre: string;
  radialClearanceMm: Num;
  spokeClearanceMm: Num;
  measuredWhere: string;
  note: string;
};

export type FormValues = {
  chassisMode: 'existing' | 'new';
  chassisId: string;
  newChassis: {
    make: string;
    model: string;
    code: string;
    yearFrom: Num;
    yearTo: Num;
    body: string;
    lugCount: Num;
    pcdMm: Num;
    centreBoreMm: Num;
    wheelBoltThread: string;
    stockWheel: { diameterIn: Num; widthIn: Num; offsetMm: Num; tyre: string };
  };
  axle: '' | Axle;
  category: '' | Category;
  body: string;
  data: {
    title: string;
    summary: string;
    parts: {
      partId: string;
      role: string;
      kind: PartKind;
      name: string;
      maker: string;
      partNumbers: string;
      cameOn: string;
      quantity: Num;
      notes: string;
    }[];
    hasAdapter: boolean;
    adapter: { name: string; maker: string; partNumber: string; hardwareIncluded: string; notes: string };
    calipers: CaliperValues[];
    shims: {
      joint: Of<typeof shimJoints>;
      direction: Of<typeof shimDirections>;
      thicknessMm: Num;
      quantity: Num;
      notes: string;
    }[];
    centring: { joint: Of<typeof shimJoints>; gapMm: Num; positions: Num };
    spacers: {
      axle: Axle;
      thicknessMm: Num;
      hubCentric: boolean;
      mounting: 'slip_on' | 'bolt_on';
      material: Of<typeof spacerMaterials>;
      quantity: Num;
      notes: string;
    }[];
    rotors: RotorValues[];
    machining: {
      component: MachiningComponent;
      operation: 'grind' | 'machine' | 'drill' | 'trim';
      where: string;
      required: boolean;
      amountMm: Num;
      notes: string;
    }[];
    fasteners: FastenerValues[];
    hasWheel: boolean;
    wheel: {
      minDiameterIn: Num;
      barrelInnerDiameterMm: Num;
      caliperRadialProjectionMm: Num;
      caliperOutboardMm: Num;
      testedWheels: TestedWheelValues[];
      notes: string;
    };
    hasBrakes: boolean;
    brakes: {
      linePressureBar: Num;
      padMu: Num;
      before: { front: CornerValues; rear: CornerValues };
      after: { front: CornerValues; rear: CornerValues };
    };
    currency: string;
    costs: { route: CostRoute; item: string; amount: Num }[];
    installHours: Num;
    difficulty: Num;
    tools: string;
    parkingBrakeType: '' | Of<typeof parkingBrakeTypes>;
    parkingBrakeKept: 'yes' | 'no';
  };
};

export const emptyPart = (): FormValues['data']['parts'][number] => ({
  partId: '',
  role: '',
  kind: 'caliper',
  name: '',
  maker: '',
  partNumbers: '',
  cameOn: '',
  quantity: '2',
  notes: '',
});
const emptyCorner = (): CornerValues => ({
  kind: 'disc',
  pistonsPerSideMm: '',
  rotorDiameterMm: '',
  padHeightMm: '',
  wheelCylinderBoreMm: '',
  drumDiameterMm: '',
  shoeType: 'leading_trailing',
  brakeFactor: '',
});

export const emptyCaliper = (axle: Axle): CaliperValues => ({
  axle,
  name: '',
  type: 'fixed',
  inboardMm: '',
  outboardMm: '',
  mountType: 'radial',
  mountSpacingMm: '',
  mountThread: '',
  designDiameterMm: '',
  designThicknessMinMm: '',
  designThicknessMaxMm: '',
  padHeightMm: '',
  bleedScrewWhenFitted: '',
  notes: '',
});

export const emptyRotor = (axle: Axle): RotorValues => ({
  axle,
  diameterMm: '',
  thicknessMm: '',
  minThicknessMm: '',
  hatHeightMm: '',
  frictionRingInnerDiameterMm: '',
  centreBoreMm: '',
  vented: true,
  directional: false,
  massKg: '',
  parkingDrumDiameterMm: '',
  partNumber: '',
  notes: '',
});

/** a short id no other fastener of the form holds, e.g. "wheel-2" */
export function newFastenerId(kind: FastenerKind, taken: readonly { id: string }[]): string {
  const base = kind.replace(/_/g, '-');
  const ids = new Set(taken.map((f) => f.id));
  if (!ids.has(base)) return base;
  let n = 2;
  while (ids.has(`${base}-${n}`)) n++;
  return `${base}-${n}`;
}

export const emptyFastener = (kind: FastenerKind, taken: readonly { id: string }[]): FastenerValues => ({
  id: newFastenerId(kind, taken),
  kind,
  label: '',
  thread: '',
  lengthMm: '',
  propertyClass: '',
  quantity: '',
  nm: '',
  lubrication: 'not_stated',
  angleDeg: '',
  singleUse: false,
  notes: '',
});

export const emptyTestedWheel = (): TestedWheelValues => ({
  diameterIn: '',
  widthIn: '',
  offsetMm: '',
  spacerMm: '0',
  outcome: 'fits',
  change: '',
  material: 'not_stated',
  centreBoreMm: '',
  seat: 'not_stated',
  tyre: '',
  radialClearanceMm: '',
  spokeClearanceMm: '',
  measuredWhere: '',
  note: '',
});

export function emptyValues(): FormValues {
  return {
    chassisMode: 'existing',
    chassisId: '',
    newChassis: {
      make: '',
      model: '',
      code: '',
      yearFrom: '',
      yearTo: '',
      body: '',
      lugCount: '5',
      pcdMm: '',
      centreBoreMm: '',
      wheelBoltThread: '',
      stockWheel: { diameterIn: '', widthIn: '', offsetMm: '', tyre: '' },
    },
    axle: '',
    category: '',
    body: '',
    data: {
      title: '',
      summary: '',
      parts: [emptyPart()],
      hasAdapter: false,
      adapter: { name: '', maker: '', partNumber: '', hardwareIncluded: '', notes: '' },
      calipers: [],
      shims: [],
      centring: { joint: 'bracket_to_knuckle', gapMm: '', positions: '4' },
      spacers: [],
      rotors: [],
      machining: [],
      fasteners: [],
      hasWheel: false,
      wheel: {
        minDiameterIn: '',
        barrelInnerDiameterMm: '',
        caliperRadialProjectionMm: '',
        caliperOutboardMm: '',
        testedWheels: [],
        notes: '',
      },
      hasBrakes: false,
      brakes: {
        linePressureBar: '50',
        padMu: '0.4',
        before: { front: emptyCorner(), rear: emptyCorner() },
        after: { front: emptyCorner(), rear: emptyCorner() },
      },
      currency: 'EUR',
      costs: [],
      installHours: '',
      difficulty: '',
      tools: '',
      parkingBrakeType: '',
      parkingBrakeKept: 'yes',
    },
  };
}

// ---------- text ↔ values ----------

const str = (n: number | null | undefined) => (n === null || n === undefined ? '' : String(n));

export const num = readNumber;
const numOrNull = (text: string) => num(text) ?? null;

export const splitWords = (text: string) =>
  text
    .split(/[,\n]/)
    .map((s) => s.trim())
    .filter(Boolean);
export const splitLines = (text: string) =>
  text
    .split('\n')
    .map((s) => s.trim())
    .filter(Boolean);

function cornerOf(c: CornerValues) {
  return c.kind === 'drum'
    ? {
        kind: 'drum',
        wheelCylinderBoreMm: num(c.wheelCylinderBoreMm),
        drumDiameterMm: num(c.drumDiameterMm),
        shoeType: c.shoeType,
        ...(c.brakeFactor.trim() ? { brakeFactor: num(c.brakeFactor) } : {}),
      }
    : {
        kind: 'disc',
        pistonsPerSideMm: numberList(c.pistonsPerSideMm),
        rotorDiameterMm: num(c.rotorDiameterMm),
        padHeightMm: num(c.padHeightMm),
      };
}
const cornerValues = (c: BrakeCorner): CornerValues =>
  c.kind === 'drum'
    ? {
        ...emptyCorner(),
        kind: 'drum',
        wheelCylinderBoreMm: str(c.wheelCylinderBoreMm),
        drumDiameterMm: str(c.drumDiameterMm),
        shoeType: c.shoeType,
        brakeFactor: str(c.brakeFactor),
      }
    : {
        ...emptyCorner(),
        pistonsPerSideMm: c.pistonsPerSideMm.join('; '),
        rotorDiameterMm: str(c.rotorDiameterMm),
        padHeightMm: str(c.padHeightMm),
      };

// ---------- the units toggle ----------
// The form always holds lengths in mm, torque in N·m and pressure in bar, exactly as stored;
// an input in imperial shows a text derived from that and converts what is typed back at once
// (src/lib/quantity-text.ts). Switching the toggle re-derives the text and never rewrites the held
// value, so nothing drifts.
/** Only the amount is typed in major units (12.50); the record keeps integer minor units. */
const toMinor = (text: string) => {
  const v = num(text);
  return v === undefined ? undefined : Number.isFinite(v) ? Math.round(v * 100) : v;
};

/** The structured record as the shared schema reads it (unparsed: the schema decides what is wrong). */
export function dataOf(d: FormValues['data']): unknown {
  const withTorque = d.fasteners.filter((f) => f.nm.trim() !== '');
  return {
    schemaVersion: SWAP_DATA_VERSION,
    title: d.title,
    summary: d.summary,
    parts: d.parts.map((p) => ({
      ...(p.partId ? { partId: Number(p.partId) } : {}),
      role: p.role,
      kind: p.kind,
      name: p.name,
      maker: p.maker,
      partNumbers: splitWords(p.partNumbers),
      cameOn: splitLines(p.cameOn),
      quantity: num(p.quantity),
      notes: p.notes,
    })),
    adapter: d.hasAdapter ? { ...d.adapter, hardwareIncluded: splitLines(d.adapter.hardwareIncluded) } : null,
    calipers: d.calipers.map(caliperOf),
    rotors: d.rotors.map((r) => ({
      axle: r.axle,
      diameterMm: num(r.diameterMm),
      thicknessMm: num(r.thicknessMm),
      ...optionalNumbers(r, [
        'minThicknessMm',
        'hatHeightMm',
        'frictionRingInnerDiameterMm',
        'centreBoreMm',
        'massKg',
        'parkingDrumDiameterMm',
      ]),
      vented: r.vented,
      directional: r.directional,
      partNumber: r.partNumber,
      notes: r.notes,
    })),
    shims: d.shims.map((s) => ({ ...s, thicknessMm: num(s.thicknessMm), quantity: num(s.quantity) })),
    centring: d.centring.gapMm.trim()
      ? { joint: d.centring.joint, gapMm: num(d.centring.gapMm), positions: num(d.centring.positions) }
      : null,
    spacers: d.spacers.map((s) => ({ ...s, thicknessMm: num(s.thicknessMm), quantity: num(s.quantity) })),
    machining: d.machining.map(({ amountMm, ...m }) => ({ ...m, ...optionalNumbers({ amountMm }, ['amountMm']) })),
    fasteners: d.fasteners.map((f) => ({
      id: f.id,
      kind: f.kind,
      label: f.label,
      thread: f.thread,
      propertyClass: f.propertyClass,
      ...optionalNumbers(f, ['lengthMm', 'quantity']),
    })),
    torque: withTorque.map((f) => ({
      fastenerId: f.id,
      nm: num(f.nm),
      lubrication: f.lubrication,
      ...optionalNumbers(f, ['angleDeg']),
      singleUse: f.singleUse,
      notes: f.notes,
    })),
    wheel: d.hasWheel ? wheelOf(d.wheel) : null,
    brakes: d.hasBrakes ? brakesOf(d.brakes) : null,
    currency: d.currency.trim().toUpperCase(),
    costs: d.costs.map((c) => ({ route: c.route, item: c.item, amountMinor: toMinor(c.amount) })),
    installHours: numOrNull(d.installHours),
    difficulty: numOrNull(d.difficulty),
    tools: splitLines(d.tools),
    parkingBrake: d.parkingBrakeType === '' ? null : { type: d.parkingBrakeType, kept: d.parkingBrakeKept === 'yes' },
  };
}

/** the listed fields that hold text, as numbers; empty ones are left out (they are optional) */
function optionalNumbers<K extends string>(row: Record<K, string>, keys: K[]): Partial<Record<K, number>> {
  const out: Partial<Record<K, number>> = {};
  for (const k of keys) {
    const v = num(row[k]);
    if (v !== undefined) out[k] = v;
  }
  return out;
}

function caliperOf(c: CaliperValues) {
  const pistons = [
    ...numberList(c.inboardMm).map((diameterMm) => ({ diameterMm, side: 'inboard' })),
    ...(c.type === 'fixed' ? numberList(c.outboardMm).map((diameterMm) => ({ diameterMm, side: 'outboard' })) : []),
  ];
  return {
    axle: c.axle,
    name: c.name,
    type: c.type,
    pistons,
    mount: { type: c.mountType, ...optionalNumbers({ spacingMm: c.mountSpacingMm }, ['spacingMm']), thread: c.mountThread },
    designRotor: optionalNumbers(
      { diameterMm: c.designDiameterMm, thicknessMinMm: c.designThicknessMinMm, thicknessMaxMm: c.designThicknessMaxMm },
      ['diameterMm', 'thicknessMinMm', 'thicknessMaxMm'],
    ),
    ...optionalNumbers(c, ['padHeightMm']),
    bleedScrewWhenFitted: c.bleedScrewWhenFitted || null,
    notes: c.notes,
  };
}

function wheelOf(w: FormValues['data']['wheel']) {
  return {
    minDiameterIn: num(w.minDiameterIn),
    barrelInnerDiameterMm: num(w.barrelInnerDiameterMm),
    caliperRadialProjectionMm: num(w.caliperRadialProjectionMm),
    caliperOutboardMm: num(w.caliperOutboardMm),
    testedWheels: w.testedWheels.map((t) => ({
      diameterIn: num(t.diameterIn),
      widthIn: num(t.widthIn),
      offsetMm: num(t.offsetMm),
      spacerMm: num(t.spacerMm) ?? 0,
      outcome: t.outcome,
      change: t.change,
      material: t.material,
      seat: t.seat,
      tyre: t.tyre,
      ...optionalNumbers(t, ['centreBoreMm', 'radialClearanceMm', 'spokeClearanceMm']),
      measuredWhere: t.measuredWhere,
      note: t.note,
    })),
    notes: w.notes,
  };
}

function brakesOf(b: FormValues['data']['brakes']) {
  return {
    linePressureBar: num(b.linePressureBar),
    padMu: num(b.padMu),
    before: { front: cornerOf(b.before.front), rear: cornerOf(b.before.rear) },
    after: { front: cornerOf(b.after.front), rear: cornerOf(b.after.rear) },
  };
}

function newChassisOf(c: FormValues['newChassis']) {
  return {
    make: c.make,
    model: c.model,
    code: c.code,
    yearFrom: num(c.yearFrom),
    yearTo: numOrNull(c.yearTo),
    body: c.body,
    lugCount: num(c.lugCount),
    pcdMm: num(c.pcdMm),
    centreBoreMm: num(c.centreBoreMm),
    wheelBoltThread: c.wheelBoltThread,
    ...(c.stockWheel.diameterIn.trim()
      ? {
          stockWheel: {
            diameterIn: num(c.stockWheel.diameterIn),
            widthIn: num(c.stockWheel.widthIn),
            offsetMm: num(c.stockWheel.offsetMm),
            tyre: c.stockWheel.tyre,
          },
        }
      : {}),
  };
}

/** The request body of POST /api/submissions (also PATCH, without swapSlug). */
export function toPayload(v: FormValues, swapSlug: string | null): unknown {
  const data = dataOf(v.data);
  if (swapSlug) return { swapSlug, data, body: v.body };
  return {
    ...(v.chassisMode === 'existing'
      ? v.chassisId
        ? { chassisId: Number(v.chassisId) }
        : {}
      : { newChassis: newChassisOf(v.newChassis) }),
    axle: v.axle || undefined,
    category: v.category || undefined,
    data,
    body: v.body,
  };
}

export function valuesFromData(data: SwapData, body: string, base: FormValues = emptyValues()): FormValues {
  return {
    ...base,
    body,
    data: {
      title: data.title,
      summary: data.summary,
      parts: data.parts.map((p) => ({
        partId: str(p.partId),
        role: p.role,
        kind: p.kind,
        name: p.name,
        maker: p.maker,
        partNumbers: p.partNumbers.join(', '),
        cameOn: p.cameOn.join('\n'),
        quantity: str(p.quantity),
        notes: p.notes,
      })),
      hasAdapter: data.adapter !== null,
      adapter: data.adapter ? { ...data.adapter, hardwareIncluded: data.adapter.hardwareIncluded.join('\n') } : base.data.adapter,
      calipers: data.calipers.map((c) => ({
        axle: c.axle,
        name: c.name,
        type: c.type,
        inboardMm: c.pistons
          .filter((p) => p.side === 'inboard')
          .map((p) => p.diameterMm)
          .join('; '),
        outboardMm: c.pistons
          .filter((p) => p.side === 'outboard')
          .map((p) => p.diameterMm)
          .join('; '),
        mountType: c.mount.type,
        mountSpacingMm: str(c.mount.spacingMm),
        mountThread: c.mount.thread,
        designDiameterMm: str(c.designRotor.diameterMm),
        designThicknessMinMm: str(c.designRotor.thicknessMinMm),
        designThicknessMaxMm: str(c.designRotor.thicknessMaxMm),
        padHeightMm: str(c.padHeightMm),
        bleedScrewWhenFitted: c.bleedScrewWhenFitted ?? '',
        notes: c.notes,
      })),
      shims: data.shims.map((s) => ({ ...s, thicknessMm: str(s.thicknessMm), quantity: str(s.quantity) })),
      centring: data.centring
        ? { joint: data.centring.joint, gapMm: str(data.centring.gapMm), positions: str(data.centring.positions) }
        : base.data.centring,
      spacers: data.spacers.map((s) => ({ ...s, thicknessMm: str(s.thicknessMm), quantity: str(s.quantity) })),
      rotors: data.rotors.map((r) => ({
        ...r,
        diameterMm: str(r.diameterMm),
        thicknessMm: str(r.thicknessMm),
        minThicknessMm: str(r.minThicknessMm),
        hatHeightMm: str(r.hatHeightMm),
        frictionRingInnerDiameterMm: str(r.frictionRingInnerDiameterMm),
        centreBoreMm: str(r.centreBoreMm),
        massKg: str(r.massKg),
        parkingDrumDiameterMm: str(r.parkingDrumDiameterMm),
      })),
      machining: data.machining.map((m) => ({ ...m, amountMm: str(m.amountMm) })),
      fasteners: data.fasteners.map((f) => {
        const t = data.torque.find((row) => row.fastenerId === f.id);
        return {
          id: f.id,
          kind: f.kind,
          label: f.label,
          thread: f.thread,
          lengthMm: str(f.lengthMm),
          propertyClass: f.propertyClass,
          quantity: str(f.quantity),
          nm: str(t?.nm),
          lubrication: t?.lubrication ?? 'not_stated',
          angleDeg: str(t?.angleDeg),
          singleUse: t?.singleUse ?? false,
          notes: t?.notes ?? '',
        };
      }),
      hasWheel: data.wheel !== null,
      wheel: data.wheel
        ? {
            minDiameterIn: str(data.wheel.minDiameterIn),
            barrelInnerDiameterMm: str(data.wheel.barrelInnerDiameterMm),
            caliperRadialProjectionMm: str(data.wheel.caliperRadialProjectionMm),
            caliperOutboardMm: str(data.wheel.caliperOutboardMm),
            testedWheels: data.wheel.testedWheels.map((t) => ({
              ...t,
              diameterIn: str(t.diameterIn),
              widthIn: str(t.widthIn),
              offsetMm: str(t.offsetMm),
              spacerMm: str(t.spacerMm),
              centreBoreMm: str(t.centreBoreMm),
              radialClearanceMm: str(t.radialClearanceMm),
              spokeClearanceMm: str(t.spokeClearanceMm),
            })),
            notes: data.wheel.notes,
          }
        : base.data.wheel,
      hasBrakes: data.brakes !== null,
      brakes: data.brakes
        ? {
            linePressureBar: str(data.brakes.linePressureBar),
            padMu: str(data.brakes.padMu),
            before: { front: cornerValues(data.brakes.before.front), rear: cornerValues(data.brakes.before.rear) },
            after: { front: cornerValues(data.brakes.after.front), rear: cornerValues(data.brakes.after.rear) },
          }
        : base.data.brakes,
      currency: data.currency,
      costs: data.costs.map((c) => ({ route: c.route, item: c.item, amount: (c.amountMinor / 100).toFixed(2) })),
      installHours: str(data.installHours),
      difficulty: str(data.difficulty),
      tools: data.tools.join('\n'),
      parkingBrakeType: data.parkingBrake?.type ?? '',
      parkingBrakeKept: data.parkingBrake && !data.parkingBrake.kept ? 'no' : 'yes',
    },
  };
}

export function valuesFromChassis(chassisId: number, axle: Axle, category: Category, base: FormValues): FormValues {
  return { ...base, chassisMode: 'existing', chassisId: String(chassisId), axle, category };
}

/** "Before" figures from the chassis' stock brakes, which the catalogue already knows. */
export function stockCorner(c: ChassisView['stockBrakes']['front']): CornerValues {
  return cornerValues(c);
}

// ---------- validation ----------

/** Friendlier words for zod's generic messages; the schema's own messages always win. */
export function friendlyIssue(issue: {
  code: string;
  input?: unknown;
  minimum?: unknown;
  maximum?: unknown;
  origin?: string;
}): string | undefined {
  if (issue.code === 'invalid_type')
    return issue.input === undefined || issue.input === null
      ? 'Needed'
      : typeof issue.input === 'number'
        ? 'Enter a number'
        : 'Check this value';
  if (issue.code === 'too_small' && issue.origin === 'number') return `At least ${String(issue.minimum)}`;
  if (issue.code === 'too_big' && issue.origin === 'number') return `At most ${String(issue.maximum)}`;
  if (issue.code === 'too_big' && issue.origin === 'string') return `At most ${String(issue.maximum)} characters`;
  if (issue.code === 'too_small' && issue.origin === 'string')
    return Number(issue.minimum) <= 1 ? 'Needed' : `At least ${String(issue.minimum)} characters`;
  if (issue.code === 'too_big' && issue.origin === 'array') return `At most ${String(issue.maximum)} entries`;
  if (issue.code === 'invalid_value') return 'Pick one of the choices';
  return undefined;
}

/**
 * A schema path (server field or zod issue) → the form field showing it: list items of a
 * word list collapse onto their text box, amounts onto the typed amount.
 */
export function formPathOf(path: string): string {
  return path
    .replace(/^(data\.parts\.\d+\.(?:partNumbers|cameOn))\.\d+$/, '$1')
    .replace(/^(data\.adapter\.hardwareIncluded)\.\d+$/, '$1')
    .replace(/^(data\.tools)\.\d+$/, '$1')
    .replace(/^(data\.brakes\.(?:before|after)\.(?:front|rear)\.pistonsPerSideMm)\.\d+$/, '$1')
    .replace(/^(data\.calipers\.\d+)\.pistons(?:\.\d+.*)?$/, '$1.inboardMm')
    .replace(/^(data\.calipers\.\d+)\.mount\.spacingMm$/, '$1.mountSpacingMm')
    .replace(/^(data\.calipers\.\d+)\.mount\.thread$/, '$1.mountThread')
    .replace(/^(data\.calipers\.\d+)\.designRotor\.diameterMm$/, '$1.designDiameterMm')
    .replace(/^(data\.calipers\.\d+)\.designRotor\.thickness(Min|Max)Mm$/, '$1.designThickness$2Mm')
    .replace(/^data\.torque\.\d+\.fastenerId$/, 'data.fasteners.root')
    .replace(/^data\.parkingBrake(?:\..*)?$/, 'data.parkingBrakeType')
    .replace(/^(data\.costs\.\d+)\.amountMinor$/, '$1.amount')
    .replace(/^newChassis$/, 'newChassis.make')
    .replace(/^data\.parts$/, 'data.parts.root');
}

export type ParseResult = { ok: true; payload: CreateSubmission } | { ok: false; issues: { path: string; message: string }[] };

const placeholderData = {
  schemaVersion: SWAP_DATA_VERSION,
  title: 'placeholder title',
  parts: [{ role: 'x', kind: 'caliper', name: 'xx', quantity: 1 }],
};

/** a torque row's error belongs to the form row of its fastener (rows without a value write no torque row) */
function torqueRowToFastener(v: FormValues, path: string): string {
  const m = /^data\.torque\.(\d+)\.(.+)$/.exec(path);
  if (!m) return path;
  const rows = v.data.fasteners.flatMap((f, i) => (f.nm.trim() !== '' ? [i] : []));
  const row = rows[Number(m[1])];
  return row === undefined ? path : `data.fasteners.${row}.${m[2]}`;
}

export function parsePayload(v: FormValues, swapSlug: string | null): ParseResult {
  const payload = toPayload(v, swapSlug) as Record<string, unknown>;
  const opts = { error: (iss: unknown) => friendlyIssue(iss as never) };
  const result = createSubmissionSchema.safeParse(payload, opts);
  if (result.success) return { ok: true, payload: result.data };
  const issues = result.error.issues.map((i) => ({
    path: torqueRowToFastener(v, formPathOf(i.path.map(String).join('.'))),
    message: i.message,
  }));
  // the schema's whole-object rules (chassis, axle, category) only run once the record reads;
  // run them against a stand-in record too, so those fields are marked at the same time
  const outer = createSubmissionSchema.safeParse({ ...payload, data: placeholderData }, opts);
  if (!outer.success) {
    for (const i of outer.error.issues) {
      const path = formPathOf(i.path.map(String).join('.'));
      if (!path.startsWith('data') && !issues.some((x) => x.path === path)) issues.push({ path, message: i.message });
    }
  }
  return { ok: false, issues };
}

export function errorsOf(issues: { path: string; message: string }[]): FieldErrors<FormValues> {
  const errors: FieldErrors<FormValues> = {};
  for (const i of issues) if (!get(errors, i.path)) set(errors, i.path, { type: 'schema', message: i.message });
  return errors;
}

/** The first message at a field or anywhere under it (a list's row errors show on the row). */
export function messageAt(errors: unknown, path: string): string | undefined {
  const node = get(errors, path) as unknown;
  const find = (n: unknown, depth: number): string | undefined => {
    if (!n || typeof n !== 'object' || depth > 4) return undefined;
    const m = (n as { message?: unknown }).message;
    if (typeof m === 'string' && m) return m;
    for (const [k, child] of Object.entries(n))
      if (k !== 'ref' && k !== 'type') {
        const f = find(child, depth + 1);
        if (f) return f;
      }
    return undefined;
  };
  return find(node, 0);
}

// ---------- live figures on a half-filled form ----------

type SectionSchema<T> = z.ZodType<T>;
function tryParse<T>(schema: SectionSchema<T>, value: unknown): T | null {
  const r = schema.safeParse(value);
  return r.success ? r.data : null;
}

/**
 * A complete SwapData from whatever sections already read correctly, for the figures and checks
 * beside the form; a row or section still being typed counts as absent rather than blocking the rest.
 */
export function liveDataOf(v: FormValues['data']): SwapData {
  const raw = dataOf(v) as Record<string, unknown>;
  const rows = <T>(schema: SectionSchema<T>, list: unknown) =>
    ((list as unknown[]) ?? []).map((r) => tryParse(schema, r)).filter((r): r is T => r !== null);
  const shape = swapDataSchema.shape;
  const fasteners = rows(fastenerSchema, raw.fasteners);
  const ids = new Set(fasteners.map((f) => f.id));
  return {
    schemaVersion: SWAP_DATA_VERSION,
    title: String(raw.title ?? '').trim(),
    summary: '',
    parts: rows(swapPartSchema, raw.parts),
    adapter: raw.adapter ? tryParse(adapterSchema, raw.adapter) : null,
    calipers: rows(caliperSchema, raw.calipers),
    rotors: rows(rotorSchema, raw.rotors),
    shims: rows(shimSchema, raw.shims),
    centring: raw.centring ? tryParse(centringSchema, raw.centring) : null,
    spacers: rows(spacerSchema, raw.spacers),
    machining: rows(machiningStepSchema, raw.machining),
    fasteners,
    torque: rows(torqueSpecSchema, raw.torque).filter((t) => ids.has(t.fastenerId)),
    wheel: raw.wheel ? tryParse(wheelRequirementSchema, raw.wheel) : null,
    brakes: raw.brakes ? tryParse(brakeFiguresSchema, raw.brakes) : null,
    currency: /^[A-Z]{3}$/.test(String(raw.currency)) ? String(raw.currency) : 'EUR',
    costs: rows(costLineSchema, raw.costs),
    installHours: tryParse(shape.installHours, raw.installHours),
    difficulty: tryParse(shape.difficulty, raw.difficulty),
    tools: [],
    parkingBrake: raw.parkingBrake ? tryParse(parkingBrakeSchema, raw.parkingBrake) : null,
  };
}

export function newChassisReadable(v: FormValues['newChassis']): Pick<NewChassis, 'wheelBoltThread'> | null {
  try {
    parseThread(v.wheelBoltThread);
    return { wheelBoltThread: v.wheelBoltThread.trim() };
  } catch {
    return null;
  }
}

// ---------- a draft's half-filled rows ----------
// A row that does not read yet (a fastener named, its torque still to come) never stops the rest of
// the draft from saving: it is left out of the record and kept beside it, as typed, and put back in
// its place when the draft opens again. Only sending for review waits for it.

type Issue = { path: string; message: string };

const rowIssue = /^data\.(parts|calipers|rotors|shims|spacers|machining|fasteners|costs|wheel\.testedWheels)\.(\d+)(?:\.|$)/;

function rowsOf(v: FormValues, list: IncompleteRowList): unknown[] {
  return list === 'testedWheels' ? v.data.wheel.testedWheels : (v.data[list] as unknown[]);
}
function setRowsOf(v: FormValues, list: IncompleteRowList, rows: unknown[]) {
  if (list === 'testedWheels') v.data.wheel.testedWheels = rows as TestedWheelValues[];
  else (v.data as Record<string, unknown>)[list] = rows;
}

export type DraftPayload =
  { ok: true; payload: CreateSubmission; incompleteRows: IncompleteRow[]; unfinished: Issue[] } | { ok: false; issues: Issue[] };

/** What a save sends: the record without the rows that do not read yet, and those rows as typed. */
export function draftPayload(v: FormValues, swapSlug: string | null): DraftPayload {
  const whole = parsePayload(v, swapSlug);
  if (whole.ok) return { ok: true, payload: whole.payload, incompleteRows: [], unfinished: [] };
  const bad = new Map<IncompleteRowList, Set<number>>();
  for (const issue of whole.issues) {
    const m = rowIssue.exec(issue.path);
    if (!m) continue;
    const list = (m[1] === 'wheel.testedWheels' ? 'testedWheels' : m[1]) as IncompleteRowList;
    bad.set(list, (bad.get(list) ?? new Set()).add(Number(m[2])));
  }
  if (bad.size === 0) return { ok: false, issues: whole.issues };
  const rest = structuredClone(v);
  const incompleteRows: IncompleteRow[] = [];
  for (const [list, indexes] of bad) {
    const rows = rowsOf(v, list);
    for (const index of [...indexes].sort((a, b) => a - b))
      incompleteRows.push({ list, index, row: structuredClone(rows[index]) as Record<string, unknown> });
    setRowsOf(
      rest,
      list,
      rows.filter((_, i) => !indexes.has(i)),
    );
  }
  const remainder = parsePayload(rest, swapSlug);
  if (!remainder.ok) return { ok: false, issues: whole.issues };
  return {
    ok: true,
    payload: remainder.payload,
    incompleteRows,
    unfinished: whole.issues.filter((i) => rowIssue.test(i.path)),
  };
}

/** The form of a saved draft: its record with the unfinished rows back where they stood. */
export function withIncompleteRows(values: FormValues, rows: readonly IncompleteRow[]): FormValues {
  if (rows.length === 0) return values;
  const out = structuredClone(values);
  for (const r of [...rows].sort((a, b) => a.index - b.index)) {
    const list = rowsOf(out, r.list);
    list.splice(Math.min(r.index, list.length), 0, r.row);
  }
  return out;
}

const places: [RegExp, string, string][] = [
  [/^(chassisMode|chassisId|newChassis|axle|category)/, 'chassis', 'Chassis'],
  [/^data\.(title|summary)/, 'title', 'Title'],
  [/^data\.parts/, 'parts', 'Parts'],
  [/^data\.(hasAdapter|adapter)/, 'adapter', 'Adapter'],
  [/^data\.calipers/, 'calipers', 'Calipers'],
  [/^data\.rotors/, 'rotors', 'Rotors'],
  [/^data\.(shims|centring|spacers)/, 'shims', 'Shims & spacers'],
  [/^data\.machining/, 'machining', 'Machining'],
  [/^data\.(fasteners|torque)/, 'torque', 'Fasteners & torque'],
  [/^data\.(hasWheel|wheel)/, 'wheel', 'Wheel'],
  [/^data\.(hasBrakes|brakes)/, 'brakes', 'Brakes'],
  [/^data\.(costs|currency)/, 'costs', 'Costs'],
  [/^data\./, 'job', 'The job'],
  [/^body/, 'write-up', 'Write-up'],
];
const fieldWords: Record<string, string> = {
  title: 'title',
  summary: 'summary',
  name: 'name',
  role: 'role',
  label: 'name',
  thread: 'thread',
  nm: 'torque',
  thicknessMm: 'thickness',
  diameterMm: 'diameter',
  quantity: 'quantity',
  amount: 'amount',
  item: 'item',
  where: 'where',
  chassisId: 'chassis',
  axle: 'axle',
  category: 'category',
};

/** Where a field sits on the form, in words ("Fasteners & torque, row 3, torque") and as its section's anchor. */
export function placeOf(path: string): { section: string; words: string } {
  const [, section, title] = places.find(([re]) => re.test(path)) ?? [null, 'chassis', 'The form'];
  const row = rowIssue.exec(path);
  const field = fieldWords[path.split('.').at(-1) ?? ''];
  return {
    section,
    words: [title, row ? `row ${Number(row[2]) + 1}` : null, field].filter(Boolean).join(', '),
  };
}
