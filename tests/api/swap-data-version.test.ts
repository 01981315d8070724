import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { eq, sql } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { addUser } from './support/auth-helpers';
import { addChassis } from './support/swap-fixtures';
import { addSwap, swapData } from './support/swap-rows';
import { seedDemo } from '../../server/db/seed';
import { loadRevision, checksFor } from '../../server/features/submissions/submission-views';
import { revisions, swaps } from '../../server/db/schema/index';
import { swapDataSchema } from '../../shared/schemas/swap-data';
import { upgradeSwapData } from '../../shared/schemas/swap-data-upgrade';
import type { Axle } from '../../shared/schemas/enums';

// Every revision stored before version 2, as the demo scenario wrote them (the previous release's seed).
type StoredV1 = { slug: string; axle: Axle; number: number; status: string; data: Record<string, unknown> };
const storedV1: StoredV1[] = JSON.parse(
  fs.readFileSync(path.resolve(import.meta.dirname, '../fixtures/swap-data-v1-demo.json'), 'utf8'),
);

describe('swap data version 2 on the demo scenario', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await makeTestApp();
    await seedDemo(t.db, { storage: t.storage, clock: { now: () => new Date('2026-12-01T12:00:00Z') } }, {});
  }, 60_000); // the whole demo scenario, photos included
  afterAll(() => t.close());

  it('when every approved demo record runs through every automatic review check, then none fails', () => {
    const approved = t.db.select({ id: revisions.id }).from(revisions).where(eq(revisions.status, 'approved')).all();
    expect(approved.length).toBeGreaterThanOrEqual(8);
    const failures = approved.flatMap(({ id }) => {
      const row = loadRevision(t.db, id)!;
      return checksFor(t.db, row)
        .filter((c) => c.status === 'fail')
        .map((c) => `${row.swap.slug} r${row.revision.number} ${c.id}: ${c.detail}`);
    });
    expect(failures).toEqual([]);
  });

  it('when the flagship four-piston swap is checked, then the clearance passes on measurements and the balance names its direction', () => {
    const id = t.db
      .select({ id: swaps.currentRevisionId })
      .from(swaps)
      .where(eq(swaps.slug, 'h31-front-vela-four-piston-330'))
      .get()!.id!;
    const checks = Object.fromEntries(checksFor(t.db, loadRevision(t.db, id)!).map((c) => [c.id, c]));
    expect(checks.clearance.status).toBe('pass');
    expect(checks.clearance.detail).toContain('3 wheels that do not fit');
    expect(checks.balance.detail).toContain('toward the front');
    // pad edge 330/2 − 2 = 163 mm against the 165 mm rotor radius; ring centre 46 − 14 = 32 mm, caliper 53.5 − 20 = 33.5 mm,
    // met by the record's 1.0 + 0.5 mm axial shims (plane geometry)
    expect(checks.caliper_fit).toMatchObject({
      status: 'pass',
      detail: 'Pad edge 2 mm inside the rotor edge at the least; centred on the friction ring.',
    });
  });

  it('when the H40 four-piston record is checked, then its wheel fastening passes, the ball-seat wheel on its own ball-seat bolts', () => {
    const id = t.db
      .select({ id: swaps.currentRevisionId })
      .from(swaps)
      .where(eq(swaps.slug, 'h40-front-vela-four-piston-330'))
      .get()!.id!;
    const fastening = checksFor(t.db, loadRevision(t.db, id)!).find((c) => c.id === 'fastening')!;
    // 26 mm stock bolts through 12 and 13 mm alloys leave 14 and 13 mm; 28 mm ball-seat bolts through 14 mm leave 14 mm,
    // all against 1.0 × 12 mm in a steel hub (common practice, no source)
    expect(fastening.status).toBe('pass');
    expect(fastening.detail).toBe('Seats match on 3 wheels. Least thread engagement 13 mm, within the rule.');
  });

  it('when the demo chassis are read, then the stud-and-nut pickup has its fastening and a unified thread', async () => {
    const res = await request(t.app).get('/api/chassis/tamsin-kestrel');
    expect(res.status).toBe(200);
    expect(res.body.chassis.wheelBoltThread).toBe('1/2-20 UNF');
    expect(res.body.chassis.wheelFastening).toMatchObject({ fastener: 'stud_nut', nutThreadMm: 16 });
  });

  const balanceOf = (slug: string) => {
    const id = t.db.select({ id: swaps.currentRevisionId }).from(swaps).where(eq(swaps.slug, slug)).get()!.id!;
    return checksFor(t.db, loadRevision(t.db, id)!).find((c) => c.id === 'balance')!;
  };

  it('when the H31 rear drum-in-hat swap is checked with the H31 stock figures, then the rear locking first above 0.60 g unladen is flagged as a hazard', () => {
    // the H31's proportioning valve (knee 35 bar) cuts in only above the swapped car's lock-together point
    const balance = balanceOf('h31-rear-regent-300-drum-in-hat');
    expect(balance.status).toBe('attention');
    expect(balance.detail).toMatch(
      /^Hazard: The swap moves the balance toward the rear \(front share 70\.2 % → 64\.5 %\): after it the rear locks first above 0\.60 g when unladen —/,
    );
    expect(balance.detail).toContain('(Worked out with the Halden H31 stock figures.)');
  });

  it('when the H40 rear drum-in-hat swap is checked with the H40 stock figures, then its load-sensing valve keeps the fronts first and it is no hazard', () => {
    const balance = balanceOf('h40-rear-regent-300-drum-in-hat');
    expect(balance.status).toBe('attention');
    expect(balance.detail).not.toMatch(/^Hazard/);
    expect(balance.detail).toContain('the front still locks first up to 1.00 g laden and unladen');
  });

  it('when a chassis loses its stock figures, then the same swap makes no lock-order claim and falls back to the share rule', () => {
    const row = loadRevision(
      t.db,
      t.db.select({ id: swaps.currentRevisionId }).from(swaps).where(eq(swaps.slug, 'h40-rear-regent-300-drum-in-hat')).get()!
        .id!,
    )!;
    const balance = checksFor(t.db, { ...row, chassis: { ...row.chassis, vehicle: null } }).find((c) => c.id === 'balance')!;
    expect(balance.detail).toMatch(/^Hazard: Balance moves toward the rear: front share 70\.8 % → 68\.6 %/);
    expect(balance.detail).toContain('none are known here');
  });

  it('when the sheet is read, then it serves version 2', async () => {
    const res = await request(t.app).get('/api/swaps/h31-front-vela-four-piston-330');
    expect(res.status).toBe(200);
    expect(res.body.revision.data.schemaVersion).toBe(2);
    expect(swapDataSchema.safeParse(res.body.revision.data).success).toBe(true);
  });
});

describe('upgradeSwapData from version 1', () => {
  it('when every stored version-1 demo revision is upgraded, then it validates as version 2 and keeps its figures', () => {
    expect(storedV1.length).toBe(13);
    for (const row of storedV1) {
      const v2 = upgradeSwapData(row.data, { axle: row.axle });
      const parsed = swapDataSchema.safeParse(v2);
      expect(parsed.success, `${row.slug} r${row.number}`).toBe(true);
      const v1 = row.data as {
        title: string;
        parts: unknown[];
        torque: { nm: number }[];
        rotors: { diameterMm: number }[];
        costs: unknown[];
      };
      expect(v2.schemaVersion).toBe(2);
      expect(v2.title).toBe(v1.title);
      expect(v2.parts).toHaveLength(v1.parts.length);
      expect(v2.costs).toHaveLength(v1.costs.length);
      expect(v2.torque.map((t) => t.nm)).toEqual(v1.torque.map((t) => t.nm));
      // every torque row points at a fastener of the record
      for (const t of v2.torque) expect(v2.fasteners.some((f) => f.id === t.fastenerId)).toBe(true);
      expect(v2.rotors.map((r) => [r.axle, r.diameterMm])).toEqual(v1.rotors.map((r) => [row.axle, r.diameterMm]));
    }
  });

  it('when version-1 free text names fasteners and machining, then they get the structured kinds', () => {
    const flagship = storedV1.find((r) => r.slug === 'h31-front-vela-four-piston-330' && r.status === 'approved')!;
    const v2 = upgradeSwapData(flagship.data, { axle: 'front' });
    expect(v2.fasteners.map((f) => [f.kind, f.thread])).toEqual([
      ['bracket_mount', 'M12×1.5'],
      ['caliper_mount', 'M10×1.25'],
      ['banjo', 'M10×1'],
      ['bleed_screw', ''],
      ['rotor_screw', ''],
      ['wheel', 'M12×1.5'],
    ]);
    expect(v2.machining.map((m) => m.component)).toEqual(['knuckle', 'dust_shield']);
    expect(v2.torque[0].lubrication).toBe('thread_locker');
    expect(v2.centring).toEqual({ joint: 'caliper_to_bracket', gapMm: 1.5, positions: 4 });
    expect(v2.wheel!.testedWheels.map((w) => w.outcome)).toEqual(['fits', 'does_not_fit', 'does_not_fit', 'fits']);
  });

  it('when no axle is given, then a record whose rear brakes changed puts its rotors on the rear', () => {
    const rear = storedV1.find((r) => r.slug === 'h31-rear-regent-300-drum-in-hat')!;
    expect(upgradeSwapData(rear.data).rotors.map((r) => r.axle)).toEqual(['rear']);
  });
});

describe('a version-1 row stored in the database', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await makeTestApp();
    const authorId = addUser(t.db, 'rivet_rosa').id;
    const c = addChassis(t.db);
    const { revisionIds } = addSwap(t.db, {
      slug: 'h31-rear-regent-v1',
      chassisId: c.id,
      authorId,
      axle: 'rear',
      revisions: [{ status: 'approved', data: swapData('placeholder title for a version-1 row') }],
    });
    // write the row as the previous release did: version-1 JSON, straight into the column
    const v1 = storedV1.find((r) => r.slug === 'h31-rear-regent-300-drum-in-hat')!.data;
    t.db.run(sql`update revisions set data = ${JSON.stringify(v1)} where id = ${revisionIds[0]}`);
  });
  afterAll(() => t.close());

  it('when the sheet is read, then it is served as version 2 and the row itself is left as stored', async () => {
    const res = await request(t.app).get('/api/swaps/h31-rear-regent-v1');
    expect(res.status).toBe(200);
    expect(res.body.revision.data.schemaVersion).toBe(2);
    expect(res.body.revision.data.rotors[0]).toMatchObject({ axle: 'rear', diameterMm: 300 });
    expect(res.body.revision.data.parkingBrake).toEqual({ type: 'not_stated', kept: true });
    const raw = t.db.all<{ data: string }>(sql`select data from revisions`)[0].data;
    expect(JSON.parse(raw).schemaVersion).toBeUndefined();
  });
});
