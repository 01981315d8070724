import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';
import net, { type AddressInfo, type Socket } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { parse } from 'csv-parse/sync';
import { sql } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { addUser } from './support/auth-helpers';
import { addChassis } from './support/swap-fixtures';
import { addSwap, approveNewRevision, swapData } from './support/swap-rows';
import { swapExportSchema } from '../../shared/schemas/export';
import { buildSyntheticWorld } from '../support/synthetic-catalogue';
import { writeDumps } from '../../server/features/export/dump';
import { takedowns } from '../../server/db/schema/index';
import { vehicleDataSchema } from '../../shared/schemas/vehicle';
import { chassisWheelFasteningSchema } from '../../shared/schemas/wheel-fastening';

// The open-data exports over rows arranged here: what is published and what must never leave (drafts,
// submissions in review, declined ones, superseded revisions, swaps on a proposed chassis), and cells
// written to run as formulas in a spreadsheet.

let t: TestApp;
let v1Title = '';

// the chassis figures the brake-distribution and wheel-bolt checks read: an exported swap carries them
const H31_VEHICLE = vehicleDataSchema.parse({
  unladen: { massKg: 1180, frontStaticFraction: 0.58, cgHeightMm: 520 },
  laden: null,
  wheelbaseMm: 2600,
  tyreLoadedRadiusMm: { front: 290, rear: 290 },
  rearValve: { kind: 'proportioning', kneeBar: 30, slope: 0.35 },
  basis: 'Invented stock figures for the test chassis',
});
const H31_FASTENING = chassisWheelFasteningSchema.parse({
  fastener: 'bolt',
  seat: 'cone60',
  seatHeightMm: 6,
  hubMaterial: 'steel',
  front: { threadDepthMm: 14, hole: 'through' },
});

beforeAll(async () => {
  t = await makeTestApp({ APP_URL: 'https://swapyard.example' });
  const rosa = addUser(t.db, 'rivet_rosa').id;
  // a login a spreadsheet would read as a function call
  const at = addUser(t.db, '@kai').id;
  const h31 = addChassis(t.db, 'halden-h31', { vehicle: H31_VEHICLE, wheelFastening: H31_FASTENING }).id;
  const proposed = addChassis(t.db, 'halden-h40', { model: 'H40', code: 'H40', proposed: true }).id;
  addSwap(t.db, {
    slug: 'h31-published',
    chassisId: h31,
    authorId: rosa,
    revisions: [{ status: 'approved', body: 'Fitted in a weekend.' }],
  });
  const takenDown = addSwap(t.db, {
    slug: 'h31-write-up-taken-down',
    chassisId: h31,
    authorId: rosa,
    revisions: [{ status: 'approved', body: 'Call me on 0123 for cheap parts.' }],
  });
  const now = new Date();
  t.db
    .insert(takedowns)
    .values({
      swapId: takenDown.swapId,
      revisionId: takenDown.revisionIds[0]!,
      target: 'body',
      reason: 'Personal details',
      createdById: rosa,
      createdAt: now,
    })
    .run();
  const corrected = addSwap(t.db, {
    slug: 'h31-corrected',
    chassisId: h31,
    authorId: rosa,
    revisions: [{ status: 'approved', data: swapData('First write-up') }],
  });
  approveNewRevision(t.db, corrected.swapId, swapData('Corrected write-up'), rosa);
  addSwap(t.db, {
    slug: 'h31-with-correction-in-review',
    chassisId: h31,
    authorId: rosa,
    revisions: [
      { status: 'approved', data: swapData('Approved text') },
      { status: 'in_review', data: swapData('Pending text') },
    ],
  });
  addSwap(t.db, { slug: 'h31-draft', chassisId: h31, authorId: rosa, revisions: [{ status: 'draft' }] });
  addSwap(t.db, { slug: 'h31-in-review', chassisId: h31, authorId: rosa, revisions: [{ status: 'in_review' }] });
  addSwap(t.db, { slug: 'h31-declined', chassisId: h31, authorId: rosa, revisions: [{ status: 'declined' }] });
  addSwap(t.db, { slug: 'h40-proposed', chassisId: proposed, authorId: rosa, revisions: [{ status: 'approved' }] });
  addSwap(t.db, {
    slug: 'h31-formulas',
    chassisId: h31,
    authorId: at,
    revisions: [
      {
        status: 'approved',
        data: swapData('=HYPERLINK("https://bad.example","open me")', {
          summary: "+1+cmd|' /C calc'!A0",
          adapter: { name: '-2+3', maker: 'Northgate Fabrication', partNumber: '=1+1' },
        }),
        body: '\t=SUM(A1:A9)',
      },
    ],
  });
  // stored before version 2 of the record: exported upgraded, as the sheet reads it
  const old = addSwap(t.db, { slug: 'h31-stored-v1', chassisId: h31, authorId: rosa, revisions: [{ status: 'approved' }] });
  const v1 = (
    JSON.parse(fs.readFileSync(path.resolve(import.meta.dirname, '../fixtures/swap-data-v1-demo.json'), 'utf8')) as {
      data: { title: string };
    }[]
  )[0].data;
  t.db.run(sql`update revisions set data = ${JSON.stringify(v1)} where id = ${old.revisionIds[0]}`);
  v1Title = v1.title;
  addSwap(t.db, {
    slug: 'h31-carriage-return',
    chassisId: h31,
    authorId: rosa,
    revisions: [{ status: 'approved', data: swapData('Plain title'), body: '\r=2+2' }],
  });
});
afterAll(() => t.close());

const published = [
  'h31-published',
  'h31-write-up-taken-down',
  'h31-corrected',
  'h31-with-correction-in-review',
  'h31-formulas',
  'h31-stored-v1',
  'h31-carriage-return',
];

describe('GET /api/export/swaps.json', () => {
  it('when exported, then it holds every approved swap at its current revision and nothing unpublished, with the licence', async () => {
    const res = await request(t.app).get('/api/export/swaps.json');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^application\/json/);
    const file = swapExportSchema.parse(JSON.parse(res.text));
    expect(file.swaps.map((s) => s.slug).sort()).toEqual([...published].sort());
    expect(file.count).toBe(published.length);
    expect(file.licence.spdx).toBe('CC-BY-SA-4.0');
    expect(file.licence.notice).toContain('Creative Commons Attribution-ShareAlike 4.0 International');
    const corrected = file.swaps.find((s) => s.slug === 'h31-corrected')!;
    expect(corrected.record.title).toBe('Corrected write-up');
    expect(corrected.revision.number).toBe(2);
    expect(corrected.permalink).toBe('https://swapyard.example/swaps/h31-corrected/r/2');
    expect(file.swaps.find((s) => s.slug === 'h31-with-correction-in-review')!.record.title).toBe('Approved text');
    const first = file.swaps.find((s) => s.slug === 'h31-published')!;
    expect(first.writeUp).toBe('Fitted in a weekend.');
    // a write-up a moderator took down leaves the open data too
    expect(file.swaps.find((s) => s.slug === 'h31-write-up-taken-down')!.writeUp).toBe('');
    expect(res.text).not.toContain('0123');
    expect(first.author).toBe('rivet_rosa');
    // what the checks read besides the record: the chassis' wheel bolts and stock brakes
    expect(first.chassis).toMatchObject({ slug: 'halden-h31', wheelBoltThread: 'M12×1.5', lugCount: 5, pcdMm: 112 });
    expect(first.chassis.stockBrakes.front.kind).toBe('disc');
    // and the stock figures of the brake-distribution check and the hub's wheel fastening
    expect(first.chassis.vehicle).toEqual(H31_VEHICLE);
    expect(first.chassis.wheelFastening).toEqual(H31_FASTENING);
    const upgraded = file.swaps.find((s) => s.slug === 'h31-stored-v1')!;
    expect(upgraded.record.schemaVersion).toBe(2);
    expect(upgraded.record.title).toBe(v1Title);
  });

  it('when it is fetched twice, then both answers are the same bytes, which a shared cache may keep', async () => {
    const [a, b] = [await request(t.app).get('/api/export/swaps.json'), await request(t.app).get('/api/export/swaps.json')];
    expect(a.text).toBe(b.text);
    expect(a.headers['cache-control']).toBe('public, max-age=300');
    expect(a.headers['set-cookie']).toBeUndefined();
  });
});

describe('GET /api/export/swaps.csv', () => {
  async function csv() {
    const res = await request(t.app).get('/api/export/swaps.csv');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    return res.text;
  }

  it('when exported, then the first line names the licence and the rows are the published swaps', async () => {
    const text = await csv();
    const [first] = text.split('\n');
    expect(first).toMatch(/^# Swapyard open data \(https:\/\/swapyard\.example\)/);
    expect(first).toContain('Creative Commons Attribution-ShareAlike 4.0 International (CC-BY-SA-4.0');
    const rows = parse(text, { comment: '#', columns: true }) as Record<string, string>[];
    expect(rows.map((r) => r.slug).sort()).toEqual([...published].sort());
    const corrected = rows.find((r) => r.slug === 'h31-corrected')!;
    expect(corrected.revision_number).toBe('2');
    expect(JSON.parse(corrected.record_json).title).toBe('Corrected write-up');
    expect(corrected.permalink).toBe('https://swapyard.example/swaps/h31-corrected/r/2');
  });

  it('when cells begin with =, +, -, @, a tab or a carriage return, then each is written as text behind an apostrophe', async () => {
    const rows = parse(await csv(), { comment: '#', columns: true }) as Record<string, string>[];
    const row = rows.find((r) => r.slug === 'h31-formulas')!;
    expect(row.title).toBe('\'=HYPERLINK("https://bad.example","open me")');
    expect(row.summary).toBe("'+1+cmd|' /C calc'!A0");
    expect(row.adapter).toBe("'-2+3");
    expect(row.adapter_part_number).toBe("'=1+1");
    expect(row.author).toBe("'@kai");
    expect(row.write_up).toBe("'\t=SUM(A1:A9)");
    expect(rows.find((r) => r.slug === 'h31-carriage-return')!.write_up).toBe("'\r=2+2");
    // no cell of any row starts a formula
    for (const r of rows) for (const cell of Object.values(r)) expect(cell).not.toMatch(/^[=+\-@\t\r]/);
    // numbers stay numbers
    expect(row.chassis_year_from).toBe('1991');
  });
});

describe('the daily dump', () => {
  it('when the dump is written, then its gzipped files hold what the routes serve, are served at /dumps/, and only the last 14 days are kept', async () => {
    for (let day = 1; day <= 15; day++)
      await writeDumps(t.db, t.config.dumpDir, t.config.appUrl, new Date(`2026-11-${String(day).padStart(2, '0')}T03:15:00Z`));
    const files = fs.readdirSync(t.config.dumpDir).sort();
    expect(files.filter((f) => f.endsWith('.json.gz'))).toHaveLength(15); // 14 dated and the latest
    expect(files).not.toContain('swapyard-swaps-2026-11-01.json.gz');
    expect(files).toContain('swapyard-swaps-2026-11-15.csv.gz');
    expect(files.some((f) => f.endsWith('.part'))).toBe(false);
    const unzip = (name: string) => zlib.gunzipSync(fs.readFileSync(path.join(t.config.dumpDir, name))).toString('utf8');
    expect(unzip('swapyard-swaps-2026-11-15.json.gz')).toBe((await request(t.app).get('/api/export/swaps.json')).text);
    expect(unzip('swapyard-swaps-latest.csv.gz')).toBe((await request(t.app).get('/api/export/swaps.csv')).text);
    const served = await request(t.app)
      .get('/dumps/swapyard-swaps-latest.json.gz')
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(served.status).toBe(200);
    expect(served.headers['cache-control']).toBe('public, max-age=3600');
    expect(zlib.gunzipSync(served.body as Buffer).toString('utf8')).toBe(unzip('swapyard-swaps-latest.json.gz'));
  });
});

describe('the export at scale', () => {
  it('when 10,000 swaps are exported to a reader that stops reading, then the server stops too, holding a few pieces, and finishes when it reads on', async () => {
    const big = await makeTestApp();
    try {
      const world = buildSyntheticWorld(big.db, { swaps: 10_000, parts: 2_000, chassis: 200, seed: 7 });
      const server = big.app.listen(0);
      let socket: Socket | undefined;
      server.on('connection', (s) => (socket = s));
      try {
        const { port } = server.address() as AddressInfo;
        let bytes = 0;
        let tail = '';
        let swapsSeen = 0;
        let writtenWhilePaused = 0;
        let headBytes = 0;
        // A raw socket, not http.get: the app answers the fake sign-in provider through an in-process
        // interceptor that wraps every http client socket of this process and buffers what it is sent, which
        // would hide whether the server waits for the reader. HTTP/1.0, so the body is not chunked and
        // ends with the connection.
        await new Promise<void>((resolve, reject) => {
          const client = net.connect(port, '127.0.0.1', () => {
            client.write('GET /api/export/swaps.json HTTP/1.0\r\nHost: localhost\r\nAccept-Encoding: identity\r\n\r\n');
          });
          client.setEncoding('utf8');
          let head: string | null = '';
          let paused = false;
          const take = (chunk: string) => {
            bytes += Buffer.byteLength(chunk);
            // one swap per line: count them without keeping the file
            const lines = (tail + chunk).split('\n');
            tail = lines.pop()!;
            swapsSeen += lines.filter((l) => /^,?\{"slug"/.test(l)).length;
          };
          client.on('data', (chunk: string) => {
            if (head !== null) {
              head += chunk;
              const at = head.indexOf('\r\n\r\n');
              if (at < 0) return;
              const headers = head.slice(0, at);
              expect(headers).toMatch(/^HTTP\/1\.[01] 200/);
              expect(headers).not.toMatch(/content-length/i);
              const body = head.slice(at + 4);
              head = null;
              headBytes = Buffer.byteLength(headers) + 4;
              take(body);
            } else take(chunk);
            // pause early: the kernel's loopback buffers grow with a fast reader (up to tens of MB), which
            // would hide whether the server waits for the reader
            if (!paused && bytes > 2 ** 16) {
              paused = true;
              client.pause();
              setTimeout(() => {
                // bytesWritten counts what the server handed the socket, queued or sent, headers included;
                // less what this side already holds: read, or buffered by the paused socket
                writtenWhilePaused = socket!.bytesWritten - headBytes - bytes - client.readableLength;
                client.resume();
              }, 1500);
            }
          });
          client.on('end', resolve);
          client.on('error', reject);
        });
        expect(swapsSeen).toBe(world.approvedSwaps);
        expect(tail).toBe('');
        const mb = (n: number) => n / 2 ** 20;
        console.log(
          `export at scale: ${world.approvedSwaps} swaps, ${mb(bytes).toFixed(1)} MB; while the reader paused, ${mb(writtenWhilePaused).toFixed(1)} MB were written but not yet with the reader`,
        );
        expect(mb(bytes)).toBeGreaterThan(30);
        // the file was made as the reader took it, not built whole and queued
        expect(mb(writtenWhilePaused)).toBeLessThan(12);
      } finally {
        server.close();
      }
    } finally {
      await big.close();
    }
  }, 240_000);
});
