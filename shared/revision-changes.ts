import { diffArrays, diffWords } from 'diff';
import type {
  BrakeCorner,
  Caliper,
  CostLine,
  Fastener,
  MachiningStep,
  Rotor,
  Shim,
  Spacer,
  SwapData,
  SwapPart,
  TestedWheel,
  TorqueSpec,
} from './schemas/swap-data';
import { costRouteLabels } from './schemas/enums';
import {
  caliperTypeLabels,
  drumShoeTypeLabels,
  fastenerKindLabels,
  lubricationLabels,
  machiningComponentLabels,
  mountTypeLabels,
  parkingBrakeTypeLabels,
  seatTypeLabels,
  shimDirectionLabels,
  shimJointLabels,
  wheelMaterialLabels,
  wheelOutcomeLabels,
  axleWord,
} from './schemas/swap-data-labels';

// What changed between two revisions of a swap, in the words of the sheet: rows of a list are
// paired by what they are (the same fastener, the same catalogue part or part number, the same
// tested wheel size, the same cost item on the same route), never by their place in the list, and
// nothing internal (field names, ids, list positions) reaches the reader. Measured values keep
// their quantity so the page shows them in the reader's units.

export type ChangeValue =
  | { kind: 'text'; text: string }
  | { kind: 'length'; mm: number }
  | { kind: 'lengths'; mm: number[] }
  | { kind: 'torque'; nm: number }
  | { kind: 'pressure'; bar: number }
  | { kind: 'mass'; kg: number }
  /** a figure whose unit never changes with the toggle: wheel inches, ET, degrees, hours */
  | { kind: 'number'; value: number; unit: string }
  | { kind: 'money'; minor: number; currency: string };

export type FieldChange = { label: string; before: ChangeValue | null; after: ChangeValue | null };

export type RowChange = {
  change: 'added' | 'removed' | 'changed';
  /** what the row is, in the record's own words ("Wheel to hub") */
  name: string;
  /** what kind of thing it is, when the name alone may not say ("Wheel bolts or nuts") */
  kind?: string;
  /** for a change: the fields that differ; for an added or removed row: what it holds */
  fields: FieldChange[];
};

export const changeSections = [
  'title',
  'parts',
  'adapter',
  'calipers',
  'rotors',
  'shims',
  'spacers',
  'machining',
  'fasteners',
  'wheel',
  'brakes',
  'costs',
  'job',
  'parking',
] as const;
export type ChangeSection = (typeof changeSections)[number];

export const changeSectionTitles: Record<ChangeSection, string> = {
  title: 'Title and summary',
  parts: 'Parts',
  adapter: 'Adapter',
  calipers: 'Calipers',
  rotors: 'Rotors',
  shims: 'Shims and centring',
  spacers: 'Wheel spacers',
  machining: 'Machining',
  fasteners: 'Fasteners and torque',
  wheel: 'Wheels',
  brakes: 'Brake figures',
  costs: 'Costs',
  job: 'Install time and tools',
  parking: 'Parking brake',
};

export type SectionChanges = { section: ChangeSection; title: string; rows: RowChange[] };

/** A write-up paragraph that was added, removed, or reworded (with its words marked). */
export type TextChange =
  | { change: 'added' | 'removed'; text: string }
  | { change: 'reworded'; words: { text: string; change: 'same' | 'added' | 'removed' }[] };

export type RevisionChanges = { sections: SectionChanges[]; writeUp: TextChange[] };

// ---------- values ----------

const text = (s: string | null | undefined): ChangeValue | null => (s && s.trim() ? { kind: 'text', text: s.trim() } : null);
const length = (mm: number | null | undefined): ChangeValue | null =>
  mm === undefined || mm === null ? null : { kind: 'length', mm };
const plain = (value: number | null | undefined, unit: string): ChangeValue | null =>
  value === undefined || value === null ? null : { kind: 'number', value, unit };
const yesNo = (v: boolean): ChangeValue => ({ kind: 'text', text: v ? 'Yes' : 'No' });
const list = (items: readonly string[]): ChangeValue | null => text(items.join(', '));

/** `named`: the row's name already says it, so an added or removed row does not repeat it */
type Fields<T> = [label: string, read: (row: T) => ChangeValue | null, named?: 'named'][];

const same = (a: ChangeValue | null, b: ChangeValue | null) => JSON.stringify(a) === JSON.stringify(b);

/** the fields of one row that hold something, for an added or removed row */
function facts<T>(row: T, fields: Fields<T>, side: 'before' | 'after'): FieldChange[] {
  return fields.flatMap(([label, read, named]) => {
    if (named) return [];
    const v = read(row);
    return v === null ? [] : [{ label, before: side === 'before' ? v : null, after: side === 'after' ? v : null }];
  });
}

function differences<T>(a: T, b: T, fields: Fields<T>): FieldChange[] {
  return fields.flatMap(([label, read]) => {
    const before = read(a);
    const after = read(b);
    return same(before, after) ? [] : [{ label, before, after }];
  });
}

// ---------- pairing rows by identity ----------

type Pairing<T> = { pairs: [T, T][]; removed: T[]; added: T[] };

/**
 * Pairs rows of two lists: each rule in turn pairs rows still alone (the first rule is the strongest
 * identity). Pairs come back in the newer list's order; rows left over were removed or added.
 */
export function pairRows<T>(before: readonly T[], after: readonly T[], rules: ((a: T, b: T) => boolean)[]): Pairing<T> {
  const partnerOf = new Map<number, number>();
  const taken = new Set<number>();
  for (const rule of rules) {
    after.forEach((b, j) => {
      if (partnerOf.has(j)) return;
      const i = before.findIndex((a, k) => !taken.has(k) && rule(a, b));
      if (i >= 0) {
        partnerOf.set(j, i);
        taken.add(i);
      }
    });
  }
  return {
    pairs: after.flatMap((b, j) => (partnerOf.has(j) ? [[before[partnerOf.get(j)!]!, b] as [T, T]] : [])),
    removed: before.filter((_, i) => !taken.has(i)),
    added: after.filter((_, j) => !partnerOf.has(j)),
  };
}

const norm = (s: string) => s.toLowerCase().replace(/[^a-z0-9]+/g, '');

function rowsOf<T>(
  before: readonly T[],
  after: readonly T[],
  rules: ((a: T, b: T) => boolean)[],
  fields: Fields<T>,
  name: (row: T) => string,
  kind?: (row: T) => string,
): RowChange[] {
  const { pairs, removed, added } = pairRows(before, after, rules);
  const rows: RowChange[] = [];
  const named = (row: T) => ({ name: name(row), ...(kind ? { kind: kind(row) } : {}) });
  for (const [a, b] of pairs) {
    const changed = differences(a, b, fields);
    if (changed.length) rows.push({ change: 'changed', ...named(b), fields: changed });
  }
  for (const b of added) rows.push({ change: 'added', ...named(b), fields: facts(b, fields, 'after') });
  for (const a of removed) rows.push({ change: 'removed', ...named(a), fields: facts(a, fields, 'before') });
  return rows;
}

function single<T>(before: T | null, after: T | null, fields: Fields<T>, name: string): RowChange[] {
  if (before && after) {
    const changed = differences(before, after, fields);
    return changed.length ? [{ change: 'changed', name, fields: changed }] : [];
  }
  if (after) return [{ change: 'added', name, fields: facts(after, fields, 'after') }];
  if (before) return [{ change: 'removed', name, fields: facts(before, fields, 'before') }];
  return [];
}

// ---------- the sections ----------

const partFields: Fields<SwapPart> = [
  ['Role', (p) => text(p.role), 'named'],
  ['Part', (p) => text(p.name), 'named'],
  ['Maker', (p) => text(p.maker)],
  ['Part numbers', (p) => list(p.partNumbers)],
  ['Came on', (p) => list(p.cameOn)],
  ['Quantity', (p) => plain(p.quantity, '')],
  ['Notes', (p) => text(p.notes)],
];
const sharesPartNumber = (a: SwapPart, b: SwapPart) => {
  const ours = new Set(a.partNumbers.map(norm));
  return b.partNumbers.some((n) => ours.has(norm(n)));
};
/** two lines naming different catalogue parts are different parts, whatever else they share */
const notTwoCatalogueParts = (a: SwapPart, b: SwapPart) => !(a.partId && b.partId && a.partId !== b.partId);
const partRules = [
  (a: SwapPart, b: SwapPart) => a.partId !== undefined && a.partId === b.partId,
  (a: SwapPart, b: SwapPart) => notTwoCatalogueParts(a, b) && sharesPartNumber(a, b),
  (a: SwapPart, b: SwapPart) => notTwoCatalogueParts(a, b) && a.kind === b.kind && norm(a.name) === norm(b.name),
];

type Adapter = NonNullable<SwapData['adapter']>;
const adapterFields: Fields<Adapter> = [
  ['Adapter', (a) => text(a.name)],
  ['Maker', (a) => text(a.maker)],
  ['Part number', (a) => text(a.partNumber)],
  ['Hardware included', (a) => list(a.hardwareIncluded)],
  ['Notes', (a) => text(a.notes)],
];

const pistonsOn = (c: Caliper, side: 'inboard' | 'outboard'): ChangeValue | null => {
  const mm = c.pistons.filter((p) => p.side === side).map((p) => p.diameterMm);
  return mm.length ? { kind: 'lengths', mm } : null;
};
const caliperFields: Fields<Caliper> = [
  ['Type', (c) => text(caliperTypeLabels[c.type])],
  ['Inboard pistons', (c) => pistonsOn(c, 'inboard')],
  ['Outboard pistons', (c) => pistonsOn(c, 'outboard')],
  ['Mounting', (c) => text(mountTypeLabels[c.mount.type])],
  ['Mounting bolt centres', (c) => length(c.mount.spacingMm)],
  ['Mounting thread', (c) => text(c.mount.thread)],
  ['Made for rotor diameter', (c) => length(c.designRotor.diameterMm)],
  ['Made for rotor thickness from', (c) => length(c.designRotor.thicknessMinMm)],
  ['Made for rotor thickness up to', (c) => length(c.designRotor.thicknessMaxMm)],
  ['Pad height', (c) => length(c.padHeightMm)],
  ['Bleed screw as fitted', (c) => text(c.bleedScrewWhenFitted === null ? '' : `At the ${c.bleedScrewWhenFitted}`)],
  ['Notes', (c) => text(c.notes)],
];

const rotorFields: Fields<Rotor> = [
  ['Diameter', (r) => length(r.diameterMm)],
  ['Thickness', (r) => length(r.thicknessMm)],
  ['Minimum thickness', (r) => length(r.minThicknessMm)],
  ['Hat height', (r) => length(r.hatHeightMm)],
  ['Friction ring inner diameter', (r) => length(r.frictionRingInnerDiameterMm)],
  ['Centre bore', (r) => length(r.centreBoreMm)],
  ['Vented', (r) => yesNo(r.vented)],
  ['Directional', (r) => yesNo(r.directional)],
  ['Mass', (r) => (r.massKg === undefined ? null : { kind: 'mass', kg: r.massKg })],
  ['Parking drum in the hat', (r) => length(r.parkingDrumDiameterMm)],
  ['Part number', (r) => text(r.partNumber)],
  ['Notes', (r) => text(r.notes)],
];

const shimFields: Fields<Shim> = [
  ['Joint', (s) => text(shimJointLabels[s.joint])],
  ['Moves the caliper', (s) => text(shimDirectionLabels[s.direction])],
  ['Thickness', (s) => length(s.thicknessMm)],
  ['Quantity, whole axle', (s) => plain(s.quantity, '')],
  ['Where', (s) => text(s.notes)],
];
type Centring = NonNullable<SwapData['centring']>;
const centringFields: Fields<Centring> = [
  ['Gap the shims fill', (c) => length(c.gapMm)],
  ['At the joint', (c) => text(shimJointLabels[c.joint])],
  ['Bolt positions', (c) => plain(c.positions, '')],
];

const spacerFields: Fields<Spacer> = [
  ['Thickness', (s) => length(s.thicknessMm)],
  ['Hub-centric', (s) => yesNo(s.hubCentric)],
  ['Mounting', (s) => text(s.mounting === 'bolt_on' ? 'Bolt-on (own studs)' : 'Slip-on (longer wheel bolts)')],
  ['Material', (s) => text(s.material === 'steel' ? 'Steel' : 'Aluminium')],
  ['Quantity', (s) => plain(s.quantity, '')],
  ['Notes', (s) => text(s.notes)],
];

const operationWords: Record<MachiningStep['operation'], string> = {
  grind: 'Grind',
  machine: 'Machine',
  drill: 'Drill',
  trim: 'Trim',
};
const machiningFields: Fields<MachiningStep> = [
  ['Part worked on', (m) => text(machiningComponentLabels[m.component])],
  ['Operation', (m) => text(operationWords[m.operation])],
  ['Where', (m) => text(m.where)],
  ['Required', (m) => yesNo(m.required)],
  ['Material removed', (m) => length(m.amountMm)],
  ['Notes', (m) => text(m.notes)],
];

/** a fastener and its torque line read as one row, as the sheet and the form show them */
type FastenerRow = Fastener & { torque: TorqueSpec | null };
const fastenerFields: Fields<FastenerRow> = [
  ['Kind', (f) => text(fastenerKindLabels[f.kind]), 'named'],
  ['Fastener', (f) => text(f.label), 'named'],
  ['Thread', (f) => text(f.thread)],
  ['Length', (f) => length(f.lengthMm)],
  ['Property class', (f) => text(f.propertyClass)],
  ['How many', (f) => plain(f.quantity, '')],
  ['Torque', (f) => (f.torque ? { kind: 'torque', nm: f.torque.nm } : null)],
  ['Then turned by', (f) => plain(f.torque?.angleDeg, '°')],
  ['Threads', (f) => (f.torque && f.torque.lubrication !== 'not_stated' ? text(lubricationLabels[f.torque.lubrication]) : null)],
  ['Single use', (f) => (f.torque?.singleUse ? yesNo(true) : null)],
  ['Torque notes', (f) => text(f.torque?.notes)],
];
const fastenerRows = (d: SwapData): FastenerRow[] =>
  d.fasteners.map((f) => ({ ...f, torque: d.torque.find((t) => t.fastenerId === f.id) ?? null }));

type Requirement = NonNullable<SwapData['wheel']>;
const requirementFields: Fields<Requirement> = [
  ['Smallest wheel', (w) => plain(w.minDiameterIn, '″')],
  ['Barrel inner diameter at the caliper', (w) => length(w.barrelInnerDiameterMm)],
  ['Caliper reach beyond the rotor', (w) => length(w.caliperRadialProjectionMm)],
  ['Caliper face outboard of the hub face', (w) => length(w.caliperOutboardMm)],
  ['Caliper outline', (w) => text(w.caliperOutline?.length ? `${w.caliperOutline.length} measured points` : '')],
  ['Notes', (w) => text(w.notes)],
];
const testedWheelFields: Fields<TestedWheel> = [
  ['Outcome', (w) => text(wheelOutcomeLabels[w.outcome])],
  ['What had to change', (w) => text(w.change)],
  ['Spacer', (w) => (w.spacerMm ? length(w.spacerMm) : null)],
  ['Material', (w) => (w.material === 'not_stated' ? null : text(wheelMaterialLabels[w.material]))],
  ['Centre bore', (w) => length(w.centreBoreMm)],
  ['Seat', (w) => (w.seat === 'not_stated' ? null : text(seatTypeLabels[w.seat]))],
  ['Tyre', (w) => text(w.tyre)],
  ['Measured gap to the barrel', (w) => length(w.radialClearanceMm)],
  ['Measured gap to the spokes', (w) => length(w.spokeClearanceMm)],
  ['Where it was measured', (w) => text(w.measuredWhere)],
  ['Inside profile', (w) => text(w.insideProfile?.length ? `${w.insideProfile.length} measured points` : '')],
  ['Note', (w) => text(w.note)],
];
const wheelName = (w: TestedWheel) =>
  `Tested wheel ${w.diameterIn}″ × ${w.widthIn}″, ET${w.offsetMm}${w.spacerMm ? ' with a spacer' : ''}`;

const cornerFields: Fields<BrakeCorner> = [
  ['Brake', (c) => text(c.kind === 'disc' ? 'Disc' : 'Drum')],
  ['Pistons on one side', (c) => (c.kind === 'disc' ? { kind: 'lengths', mm: c.pistonsPerSideMm } : null)],
  ['Rotor diameter', (c) => (c.kind === 'disc' ? length(c.rotorDiameterMm) : null)],
  ['Pad height', (c) => (c.kind === 'disc' ? length(c.padHeightMm) : null)],
  ['Wheel cylinder bore', (c) => (c.kind === 'drum' ? length(c.wheelCylinderBoreMm) : null)],
  ['Drum diameter', (c) => (c.kind === 'drum' ? length(c.drumDiameterMm) : null)],
  ['Shoes', (c) => (c.kind === 'drum' ? text(drumShoeTypeLabels[c.shoeType]) : null)],
  ['Brake factor', (c) => (c.kind === 'drum' ? plain(c.brakeFactor, '') : null)],
];
type Brakes = NonNullable<SwapData['brakes']>;
const brakeFields: Fields<Brakes> = [
  ['Line pressure', (b) => ({ kind: 'pressure', bar: b.linePressureBar })],
  ['Pad friction μ', (b) => plain(b.padMu, '')],
];

const costFields = (currency: string): Fields<CostLine> => [
  ['Amount', (c) => ({ kind: 'money', minor: c.amountMinor, currency })],
  ['Route', (c) => text(costRouteLabels[c.route])],
];

type Job = Pick<SwapData, 'installHours' | 'difficulty' | 'currency'>;
const jobFields: Fields<Job> = [
  ['Install time', (j) => plain(j.installHours, 'h')],
  ['Difficulty', (j) => (j.difficulty === null ? null : { kind: 'number', value: j.difficulty, unit: 'of 5' })],
  ['Currency', (j) => text(j.currency)],
];

type Parking = NonNullable<SwapData['parkingBrake']>;
const parkingFields: Fields<Parking> = [
  ['Kind', (p) => text(parkingBrakeTypeLabels[p.type])],
  ['Still works after the swap', (p) => yesNo(p.kept)],
];

function toolRows(before: readonly string[], after: readonly string[]): RowChange[] {
  const { removed, added } = pairRows(before, after, [(a, b) => norm(a) === norm(b)]);
  return [
    ...added.map((t): RowChange => ({ change: 'added', name: `Tool: ${t}`, fields: [] })),
    ...removed.map((t): RowChange => ({ change: 'removed', name: `Tool: ${t}`, fields: [] })),
  ];
}

function brakeRows(before: Brakes | null, after: Brakes | null): RowChange[] {
  const rows = single(before, after, brakeFields, 'Brake figures');
  if (!before || !after) return rows;
  for (const when of ['before', 'after'] as const)
    for (const axle of ['front', 'rear'] as const) {
      const changed = differences(before[when][axle], after[when][axle], cornerFields);
      if (changed.length) rows.push({ change: 'changed', name: `${axleWord(axle)} brakes ${when} the swap`, fields: changed });
    }
  return rows;
}

/** Everything that differs between two revisions' records and write-ups, by section, in the sheet's words. */
export function compareRevisions(
  before: { data: SwapData; body: string },
  after: { data: SwapData; body: string },
): RevisionChanges {
  const a = before.data;
  const b = after.data;
  const bySection: Record<ChangeSection, RowChange[]> = {
    title: [
      ...single(a, b, [['Title', (d) => text(d.title)]], 'Title'),
      ...single(a, b, [['Summary', (d) => text(d.summary)]], 'Summary'),
    ],
    parts: rowsOf(
      a.parts,
      b.parts,
      partRules,
      partFields,
      (p) => p.name,
      (p) => p.role,
    ),
    adapter: single(a.adapter, b.adapter, adapterFields, 'Adapter'),
    calipers: rowsOf(
      a.calipers,
      b.calipers,
      [(x, y) => x.axle === y.axle && norm(x.name) === norm(y.name), (x, y) => x.axle === y.axle],
      caliperFields,
      (c) => c.name,
      (c) => `${axleWord(c.axle)} caliper`,
    ),
    rotors: rowsOf(
      a.rotors,
      b.rotors,
      [
        (x, y) => x.axle === y.axle && x.partNumber !== '' && norm(x.partNumber) === norm(y.partNumber),
        (x, y) => x.axle === y.axle,
      ],
      rotorFields,
      (r) => `${axleWord(r.axle)} rotor${r.partNumber ? ` ${r.partNumber}` : ''}`,
    ),
    shims: [
      ...rowsOf(
        a.shims,
        b.shims,
        [
          (x, y) => x.joint === y.joint && x.direction === y.direction && x.thicknessMm === y.thicknessMm,
          (x, y) => x.joint === y.joint && x.direction === y.direction,
        ],
        shimFields,
        (s) => `Shims ${shimJointLabels[s.joint].toLowerCase()}`,
      ),
      ...single(a.centring, b.centring, centringFields, 'Measured centring gap'),
    ],
    spacers: rowsOf(
      a.spacers,
      b.spacers,
      [(x, y) => x.axle === y.axle && x.thicknessMm === y.thicknessMm, (x, y) => x.axle === y.axle],
      spacerFields,
      (s) => `${axleWord(s.axle)} wheel spacers`,
    ),
    machining: rowsOf(
      a.machining,
      b.machining,
      [
        (x, y) => x.component === y.component && x.operation === y.operation && norm(x.where) === norm(y.where),
        (x, y) => x.component === y.component && x.operation === y.operation,
      ],
      machiningFields,
      (m) => `${operationWords[m.operation]} the ${machiningComponentLabels[m.component].toLowerCase()}`,
    ),
    fasteners: rowsOf(
      fastenerRows(a),
      fastenerRows(b),
      [(x, y) => x.id === y.id, (x, y) => x.kind === y.kind && norm(x.label) === norm(y.label)],
      fastenerFields,
      (f) => f.label,
      (f) => fastenerKindLabels[f.kind],
    ),
    wheel: [
      ...single(a.wheel, b.wheel, requirementFields, 'Wheel requirement'),
      ...rowsOf(
        a.wheel?.testedWheels ?? [],
        b.wheel?.testedWheels ?? [],
        [
          (x, y) =>
            x.diameterIn === y.diameterIn && x.widthIn === y.widthIn && x.offsetMm === y.offsetMm && x.spacerMm === y.spacerMm,
        ],
        testedWheelFields,
        wheelName,
      ),
    ],
    brakes: brakeRows(a.brakes, b.brakes),
    costs: rowsOf(
      a.costs,
      b.costs,
      [(x, y) => x.route === y.route && norm(x.item) === norm(y.item), (x, y) => norm(x.item) === norm(y.item)],
      costFields(b.currency),
      (c) => `${c.item} (${costRouteLabels[c.route].toLowerCase()})`,
    ),
    job: [...single(a, b, jobFields, 'The job'), ...toolRows(a.tools, b.tools)],
    parking: single(a.parkingBrake, b.parkingBrake, parkingFields, 'Parking brake'),
  };
  return {
    sections: changeSections
      .filter((s) => bySection[s].length > 0)
      .map((s) => ({ section: s, title: changeSectionTitles[s], rows: bySection[s] })),
    writeUp: compareWriteUps(before.body, after.body),
  };
}

const paragraphs = (body: string) =>
  body
    .replace(/\r\n?/g, '\n')
    .split(/\n\s*\n/)
    .map((p) => p.trim())
    .filter(Boolean);

/** Paragraphs added, removed, or reworded (a removed one followed by an added one, with the words that differ marked). */
export function compareWriteUps(before: string, after: string): TextChange[] {
  const out: TextChange[] = [];
  let pendingRemoved: string[] = [];
  const flush = () => {
    for (const text of pendingRemoved) out.push({ change: 'removed', text });
    pendingRemoved = [];
  };
  for (const part of diffArrays(paragraphs(before), paragraphs(after))) {
    if (part.removed) {
      flush();
      pendingRemoved = [...part.value];
    } else if (part.added) {
      const added = [...part.value];
      // pair removed and added paragraphs one to one as rewordings
      while (pendingRemoved.length && added.length) {
        const was = pendingRemoved.shift()!;
        const now = added.shift()!;
        out.push({
          change: 'reworded',
          words: diffWords(was, now).map((w) => ({ text: w.value, change: w.added ? 'added' : w.removed ? 'removed' : 'same' })),
        });
      }
      flush();
      for (const text of added) out.push({ change: 'added', text });
    } else flush();
  }
  flush();
  return out;
}

/** One line naming the sections that changed, for notices such as a shop link's. */
export function summariseChanges(changes: RevisionChanges): string {
  const names = changes.sections.map((s) => s.title.toLowerCase());
  if (changes.writeUp.length) names.push('write-up');
  return names.length ? `Changed: ${names.join('; ')}.` : 'No changes to the record’s content.';
}
