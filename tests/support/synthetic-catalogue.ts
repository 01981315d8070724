import type { Db } from '../../server/db/client';
import { chassis, parts, revisions, swaps, users } from '../../server/db/schema/index';
import { swapDataSchema, type SwapData, type SwapPart } from '../../shared/schemas/swap-data';
import type { PartKind, RevisionStatus } from '../../shared/schemas/enums';
import { rng } from '../bench/search-fixtures';

// An invented catalogue at scale for the export stream and the interchange graph: chassis, catalogue parts
// (some known by several numbers, some with an older stamp in their notes, some recorded twice under a shared
// number, so the "same part" chains run several links deep) and swaps whose current revisions are full
// version-2 records. Around the approved swaps lie the rows that must never be exported or graphed: drafts,
// submissions in review, declined ones, superseded revisions and swaps on proposed chassis.
// Seeded, so every run builds the same world.

export type WorldSize = { chassis: number; parts: number; swaps: number; seed?: number };

export type SyntheticWorld = {
  /** swaps with an approved current revision on a published chassis */
  approvedSwaps: number;
  /** swaps that must not appear anywhere public */
  unpublishedSwaps: number;
  partIds: number[];
  chassisIds: number[];
  /** the part numbers of each part, in insertion order of parts */
  partNumbersOf: Map<number, string[]>;
};

const kinds: { kind: PartKind; names: string[]; share: number }[] = [
  { kind: 'caliper', names: ['four-piston fixed caliper', 'twin-piston sliding caliper', 'single-piston caliper'], share: 0.3 },
  { kind: 'rotor', names: ['vented rotor', 'solid rotor', 'rotor with drum hat'], share: 0.2 },
  { kind: 'pad', names: ['pad set'], share: 0.1 },
  { kind: 'adapter', names: ['caliper adapter', 'relocation bracket'], share: 0.15 },
  { kind: 'shim', names: ['centring shim'], share: 0.05 },
  { kind: 'spacer', names: ['hub-centric spacer'], share: 0.05 },
  { kind: 'line', names: ['braided brake hose'], share: 0.05 },
  { kind: 'hardware', names: ['wheel bolt set', 'radial bolt set'], share: 0.1 },
];

const syllables = ['ka', 'lo', 'ver', 'tan', 'mi', 'sor', 'del', 'ru', 'ne', 'bra', 'to', 'fen', 'gal', 'ix', 'que'];

export function buildSyntheticWorld(db: Db, size: WorldSize): SyntheticWorld {
  const r = rng(size.seed ?? 20);
  const now = new Date('2026-05-01T12:00:00Z');
  const word = (n: number) => {
    let w = '';
    for (let i = 0; i < n; i++) w += r.pick(syllables);
    return w[0].toUpperCase() + w.slice(1);
  };
  return db.transaction((tx) => {
    const author = tx
      .insert(users)
      .values({ provider: 'github', providerId: 'synthetic-author', login: 'synthetic_author', createdAt: now, updatedAt: now })
      .returning()
      .get();

    // ---- chassis: one in fifty proposed with a submission and not approved ----
    const chassisRows = Array.from({ length: size.chassis }, (_, i) => {
      const make = word(2);
      const model = `${make[0]}${10 + (i % 89)}`;
      return {
        slug: `${make}-${model}-${i}`.toLowerCase(),
        make,
        model,
        code: `${model}${String.fromCharCode(65 + (i % 26))}`,
        yearFrom: 1970 + (i % 50),
        yearTo: 1975 + (i % 50),
        body: 'Saloon',
        lugCount: r.pick([4, 5]),
        pcdMm: r.pick([100, 108, 112, 114.3]),
        centreBoreMm: r.pick([57.1, 60.1, 66.6]),
        wheelBoltThread: r.pick(['M12×1.5', 'M14×1.5']),
        stockWheel: { diameterIn: 15, widthIn: 6, offsetMm: 38, tyre: '195/60R15' },
        stockBrakes: {
          front: {
            kind: 'disc' as const,
            pistonsPerSideMm: [54],
            rotorDiameterMm: 280,
            padHeightMm: 50,
            description: 'Sliding caliper',
          },
          rear: {
            kind: 'disc' as const,
            pistonsPerSideMm: [36],
            rotorDiameterMm: 260,
            padHeightMm: 40,
            description: 'Sliding caliper',
          },
        },
        proposed: i % 50 === 49,
        createdAt: now,
        updatedAt: now,
      };
    });
    const chassisIds: number[] = [];
    const proposedChassis = new Set<number>();
    for (let i = 0; i < chassisRows.length; i += 400) {
      const rows = tx
        .insert(chassis)
        .values(chassisRows.slice(i, i + 400))
        .returning({ id: chassis.id, proposed: chassis.proposed })
        .all();
      for (const row of rows) {
        chassisIds.push(row.id);
        if (row.proposed) proposedChassis.add(row.id);
      }
    }
    const publishedChassis = chassisIds.filter((id) => !proposedChassis.has(id));
    const donorLabel = (i: number) =>
      `${chassisRows[i].make} ${chassisRows[i].model} ${1 + (i % 3)}.${i % 10} (${chassisRows[i].yearFrom}–${chassisRows[i].yearTo})`;

    // ---- parts: numbers, older stamps in notes, some recorded twice under a shared number ----
    const numberOf = (prefix: string, i: number, side: string) =>
      `${prefix}-${100 + (i % 900)}-${String(i).padStart(5, '0')}-${side}`;
    const partRows = Array.from({ length: size.parts }, (_, i) => {
      let roll = r.next();
      const k = kinds.find((x) => (roll -= x.share) < 0) ?? kinds[0];
      const donor = r.int(0, chassisRows.length - 1);
      const prefix = chassisRows[donor].make.slice(0, 2).toUpperCase();
      const side = r.pick(['L', 'R', 'A', 'V']);
      const numbers = [numberOf(prefix, i, side)];
      if (r.next() < 0.1) numbers.push(numberOf(prefix, i + size.parts, side)); // a later number for the same part
      let notes = `${k.names[0]} for ${chassisRows[donor].make} hubs.`;
      if (r.next() < 0.1)
        notes += ` Early ones carry the stamp ${numberOf(prefix, i + 2 * size.parts, side)} and are the same casting.`;
      return {
        slug: `synthetic-part-${i}`,
        kind: k.kind,
        name: `${chassisRows[donor].model} ${r.pick(k.names)}`,
        maker: chassisRows[donor].make,
        partNumbers: numbers,
        specs: {},
        cameOn:
          k.kind === 'adapter'
            ? []
            : [donorLabel(donor), ...(r.next() < 0.3 ? [donorLabel(r.int(0, chassisRows.length - 1))] : [])],
        notes,
        createdAt: now,
        updatedAt: now,
      };
    });
    // every twentieth part is a second record of the part before it (chains of two to four records)
    for (let i = 20; i < partRows.length; i += 20)
      for (let j = 0; j < 1 + (i % 3); j++) partRows[i + j]?.partNumbers.push(partRows[i + j - 1].partNumbers[0]);
    const partIds: number[] = [];
    const partNumbersOf = new Map<number, string[]>();
    const partById = new Map<number, (typeof partRows)[number]>();
    for (let i = 0; i < partRows.length; i += 500) {
      const batch = partRows.slice(i, i + 500);
      const ids = tx.insert(parts).values(batch).returning({ id: parts.id }).all();
      ids.forEach(({ id }, j) => {
        partIds.push(id);
        partNumbersOf.set(id, batch[j].partNumbers);
        partById.set(id, batch[j]);
      });
    }
    const byKind = new Map<PartKind, number[]>();
    for (const id of partIds) byKind.set(partById.get(id)!.kind, [...(byKind.get(partById.get(id)!.kind) ?? []), id]);
    // popularity is skewed as it is in life: a favourite donor caliper turns up in a thousand swaps
    const popular = <T>(xs: T[]) => xs[Math.floor(r.next() ** 2 * xs.length)];
    const pickOf = (kind: PartKind) => popular(byKind.get(kind) ?? partIds);
    const line = (id: number, role: string, quantity: number): SwapPart => {
      const p = partById.get(id)!;
      return {
        partId: id,
        role,
        kind: p.kind,
        name: p.name,
        maker: p.maker,
        partNumbers: p.partNumbers.slice(0, 1),
        cameOn: p.cameOn,
        quantity,
        notes: '',
      };
    };

    // ---- swaps ----
    let approvedSwaps = 0;
    let unpublishedSwaps = 0;
    const pending: { swap: typeof swaps.$inferInsert; revs: { status: RevisionStatus; data: SwapData }[] }[] = [];
    const flush = () => {
      if (pending.length === 0) return;
      const ids = tx
        .insert(swaps)
        .values(pending.map((p) => p.swap))
        .returning({ id: swaps.id })
        .all();
      const revRows = pending.flatMap((p, i) =>
        p.revs.map((rev, n) => ({
          swapId: ids[i].id,
          number: n + 1,
          authorId: author.id,
          status: rev.status,
          data: rev.data,
          body: `Fitted on a ${p.swap.axle} axle. Torque every fastener to its figure, bleed the brakes and bed in the pads.`,
          submittedAt: now,
          reviewedAt: rev.status === 'in_review' || rev.status === 'draft' ? null : now,
          createdAt: now,
          updatedAt: now,
        })),
      );
      const revIds = tx
        .insert(revisions)
        .values(revRows)
        .returning({ id: revisions.id, swapId: revisions.swapId, status: revisions.status })
        .all();
      const current = new Map<number, number>();
      for (const rev of revIds) if (rev.status === 'approved') current.set(rev.swapId, rev.id);
      const update = db.$client.prepare('update swaps set current_revision_id = ? where id = ?');
      for (const [swapId, revId] of current) update.run(revId, swapId);
      pending.length = 0;
    };
    for (let i = 0; i < size.swaps; i++) {
      // one in twenty is unpublished: only a draft, only in review, declined, or on a proposed chassis
      const unpublished = i % 20 === 7;
      const chassisId =
        unpublished && i % 40 === 7 && proposedChassis.size ? r.pick([...proposedChassis]) : popular(publishedChassis);
      const axle = r.next() < 0.7 ? ('front' as const) : ('rear' as const);
      const data = recordFor(
        r,
        i,
        axle,
        {
          caliper: pickOf('caliper'),
          rotor: pickOf('rotor'),
          pad: pickOf('pad'),
          adapter: pickOf('adapter'),
          hardware: pickOf('hardware'),
        },
        line,
        partById,
      );
      let revs: { status: RevisionStatus; data: SwapData }[];
      if (unpublished) {
        revs = proposedChassis.has(chassisId)
          ? [{ status: 'in_review', data }]
          : [{ status: r.pick(['draft', 'in_review', 'declined'] as const), data }];
        unpublishedSwaps++;
      } else {
        approvedSwaps++;
        revs = [{ status: 'approved', data }];
        // some have an older, superseded revision and some a newer one waiting in review: only the current one is public
        if (i % 10 === 3) revs.unshift({ status: 'superseded', data: { ...data, title: `${data.title} (first write-up)` } });
        if (i % 10 === 5) revs.push({ status: 'in_review', data: { ...data, title: `${data.title} (correction in review)` } });
      }
      pending.push({
        swap: {
          slug: `synthetic-swap-${i}`,
          chassisId,
          axle,
          category: 'brakes',
          authorId: author.id,
          createdAt: now,
          updatedAt: now,
        },
        revs,
      });
      if (pending.length === 300) flush();
    }
    flush();
    return { approvedSwaps, unpublishedSwaps, partIds, chassisIds, partNumbersOf };
  });
}

type Picks = Record<'caliper' | 'rotor' | 'pad' | 'adapter' | 'hardware', number>;

/** A complete version-2 record about the size of a real one (2–3 KB of JSON). */
function recordFor(
  r: ReturnType<typeof rng>,
  i: number,
  axle: 'front' | 'rear',
  picks: Picks,
  line: (id: number, role: string, quantity: number) => SwapPart,
  partById: Map<number, { name: string; partNumbers: string[]; maker: string }>,
): SwapData {
  const rotorMm = r.pick([300, 312, 320, 330, 345]);
  const adapter = partById.get(picks.adapter)!;
  const data: SwapData = {
    schemaVersion: 2,
    title: `${partById.get(picks.caliper)!.name} conversion number ${i}`,
    summary: `Donor calipers on ${rotorMm} mm rotors with a bolt-on adapter; needs a 16-inch wheel.`,
    parts: [
      line(picks.caliper, `${axle === 'front' ? 'Front' : 'Rear'} calipers`, 2),
      line(picks.rotor, 'Rotors', 2),
      line(picks.pad, 'Pads', 1),
      line(picks.adapter, 'Caliper adapter (pair)', 1),
      line(picks.hardware, 'Bolts', 1),
    ],
    adapter: {
      name: adapter.name,
      maker: adapter.maker,
      partNumber: adapter.partNumbers[0],
      hardwareIncluded: ['4 × M12×1.5 × 35 mm bolts'],
      notes: '',
    },
    calipers: [
      {
        axle,
        name: partById.get(picks.caliper)!.name,
        type: 'fixed',
        pistons: [
          { diameterMm: 40, side: 'inboard' },
          { diameterMm: 44, side: 'inboard' },
          { diameterMm: 40, side: 'outboard' },
          { diameterMm: 44, side: 'outboard' },
        ],
        mount: { type: 'radial', spacingMm: 130, thread: 'M10×1.25' },
        designRotor: { diameterMm: rotorMm, thicknessMinMm: 26, thicknessMaxMm: 28 },
        padHeightMm: 55,
        bleedScrewWhenFitted: 'top',
        notes: '',
      },
    ],
    rotors: [
      {
        axle,
        diameterMm: rotorMm,
        thicknessMm: 28,
        minThicknessMm: 26,
        hatHeightMm: 46,
        vented: true,
        directional: false,
        partNumber: '',
        notes: '',
      },
    ],
    shims: [{ joint: 'bracket_to_knuckle', direction: 'axial', thicknessMm: 1, quantity: 4, notes: '' }],
    centring: { joint: 'bracket_to_knuckle', gapMm: 1, positions: 4 },
    spacers: [],
    machining:
      i % 4 === 0 ? [{ component: 'dust_shield', operation: 'trim', where: 'Dust shield edge', required: true, notes: '' }] : [],
    fasteners: [
      {
        id: 'adapter-bolts',
        kind: 'bracket_mount',
        label: 'Adapter to knuckle',
        thread: 'M12x1.5',
        lengthMm: 35,
        propertyClass: '10.9',
        quantity: 4,
      },
      {
        id: 'caliper-bolts',
        kind: 'caliper_mount',
        label: 'Caliper to adapter',
        thread: 'M10x1.25',
        lengthMm: 45,
        propertyClass: '12.9',
        quantity: 4,
      },
    ],
    torque: [
      { fastenerId: 'adapter-bolts', nm: 95, lubrication: 'thread_locker', singleUse: false, notes: '' },
      { fastenerId: 'caliper-bolts', nm: 60, lubrication: 'not_stated', singleUse: false, notes: '' },
    ],
    wheel: {
      minDiameterIn: 16,
      caliperRadialProjectionMm: 20,
      caliperOutboardMm: 34,
      testedWheels: [
        {
          diameterIn: 16,
          widthIn: 7,
          offsetMm: 38,
          spacerMm: 0,
          outcome: 'fits',
          change: '',
          material: 'alloy',
          seat: 'cone60',
          tyre: '205/55R16',
          radialClearanceMm: 4,
          spokeClearanceMm: 5,
          measuredWhere: 'Modelling clay on the caliper, wheel turned by hand',
          note: '',
        },
      ],
      notes: '',
    },
    brakes: {
      linePressureBar: 50,
      padMu: 0.4,
      before: {
        front: { kind: 'disc', pistonsPerSideMm: [54], rotorDiameterMm: 280, padHeightMm: 50 },
        rear: { kind: 'disc', pistonsPerSideMm: [36], rotorDiameterMm: 260, padHeightMm: 40 },
      },
      after: {
        front:
          axle === 'front'
            ? { kind: 'disc', pistonsPerSideMm: [40, 44], rotorDiameterMm: rotorMm, padHeightMm: 55 }
            : { kind: 'disc', pistonsPerSideMm: [54], rotorDiameterMm: 280, padHeightMm: 50 },
        rear:
          axle === 'rear'
            ? { kind: 'disc', pistonsPerSideMm: [40, 44], rotorDiameterMm: rotorMm, padHeightMm: 55 }
            : { kind: 'disc', pistonsPerSideMm: [36], rotorDiameterMm: 260, padHeightMm: 40 },
      },
    },
    currency: 'EUR',
    costs: [
      { route: 'as_built', item: 'Used calipers, rebuilt', amountMinor: 30000 + (i % 50) * 100 },
      { route: 'as_built', item: 'Rotors and pads', amountMinor: 28000 },
      { route: 'budget', item: 'Calipers as found', amountMinor: 16000 },
      { route: 'budget', item: 'Aftermarket rotors and pads', amountMinor: 17000 },
      { route: 'new_kit', item: 'Complete kit', amountMinor: 98000 },
    ],
    installHours: 6,
    difficulty: 3,
    tools: ['Torque wrench', 'Feeler gauges'],
    parkingBrake: axle === 'rear' ? { type: 'drum_in_hat', kept: true } : null,
  };
  // the world is only worth measuring if its records are ones the app accepts
  if (i < 3) swapDataSchema.parse(data);
  return data;
}
