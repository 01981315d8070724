import type { Db } from '../../../server/db/client';
import { chassis, parts } from '../../../server/db/schema/index';
import type { SwapDataInput } from '../../../shared/schemas/swap-data';

// Invented catalogue rows and records that each test file inserts for itself.

export function addChassis(db: Db, slug = 'halden-h31', extra: Partial<typeof chassis.$inferInsert> = {}) {
  const now = new Date();
  return db
    .insert(chassis)
    .values({
      slug,
      make: 'Halden',
      model: 'H31',
      code: 'H31',
      yearFrom: 1991,
      yearTo: 1999,
      body: 'Saloon, coupe',
      lugCount: 5,
      pcdMm: 112,
      centreBoreMm: 66.6,
      wheelBoltThread: 'M12×1.5',
      stockWheel: { diameterIn: 15, widthIn: 6, offsetMm: 38, tyre: '195/60R15' },
      stockBrakes: {
        front: {
          kind: 'disc',
          pistonsPerSideMm: [54],
          rotorDiameterMm: 280,
          padHeightMm: 50,
          description: 'Single-piston sliding caliper',
        },
        rear: {
          kind: 'disc',
          pistonsPerSideMm: [38],
          rotorDiameterMm: 280,
          padHeightMm: 40,
          description: 'Single-piston sliding caliper',
        },
      },
      createdAt: now,
      updatedAt: now,
      ...extra,
    })
    .returning()
    .get();
}

export function addPart(db: Db, slug: string, extra: Partial<typeof parts.$inferInsert> = {}) {
  const now = new Date();
  return db
    .insert(parts)
    .values({
      slug,
      kind: 'caliper',
      name: 'Vela four-piston fixed front caliper, left',
      maker: 'Orsino',
      partNumbers: ['OV-355-104-L'],
      specs: { pistonsPerSideMm: [40, 44], opposed: true },
      cameOn: ['Orsino Vela 3.0 (1994–1998)'],
      createdAt: now,
      updatedAt: now,
      ...extra,
    })
    .returning()
    .get();
}

/** A complete front-brake record that passes every automatic check once it has a photo. */
export function swapRecord(extra: Partial<SwapDataInput> = {}): SwapDataInput {
  return {
    schemaVersion: 2,
    title: 'Vela four-piston calipers on 330 mm rotors',
    summary: 'Bolt-on with a bracket and a 10 mm spacer.',
    parts: [
      {
        role: 'Front caliper',
        kind: 'caliper',
        name: 'Vela four-piston fixed front caliper, left',
        maker: 'Orsino',
        partNumbers: ['OV-355-104-L'],
        cameOn: ['Orsino Vela 3.0 (1994–1998)'],
        quantity: 1,
      },
    ],
    adapter: {
      name: 'H31 radial caliper bracket',
      maker: 'Northgate Fabrication',
      partNumber: 'NF-H31-VB',
      hardwareIncluded: ['M12 caliper bolts, 4'],
    },
    rotors: [{ axle: 'front', diameterMm: 330, thicknessMm: 28, vented: true }],
    fasteners: [
      { id: 'caliper-bolts', kind: 'caliper_mount', label: 'Caliper to bracket', thread: 'M12x1.5' },
      { id: 'bracket-bolts', kind: 'bracket_mount', label: 'Bracket to knuckle', thread: 'M12x1.5' },
    ],
    torque: [
      { fastenerId: 'caliper-bolts', nm: 85 },
      { fastenerId: 'bracket-bolts', nm: 110 },
    ],
    wheel: {
      minDiameterIn: 16,
      caliperRadialProjectionMm: 12,
      caliperOutboardMm: 30,
      testedWheels: [{ diameterIn: 16, widthIn: 7, offsetMm: 38, outcome: 'fits', radialClearanceMm: 6, spokeClearanceMm: 5 }],
    },
    costs: [
      { route: 'as_built', item: 'Used calipers', amountMinor: 32000 },
      { route: 'new_kit', item: 'Complete kit', amountMinor: 98000 },
    ],
    ...extra,
  };
}
