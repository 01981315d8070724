import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import { closeDb, openDb } from '../../server/db/client';
import { parts, revisions } from '../../server/db/schema/index';
import { swapData } from './support/swap-rows';

// The catalogue gained kinds beyond brakes. Parts stored before, as plain hardware, take the kind their name
// says; their numbers, specs and the lines that point at them keep everything else.

const migrations = path.resolve(import.meta.dirname, '../../drizzle');

describe('the migration that adds part kinds', () => {
  it('when hardware parts are named as wheel bolts, anti-roll bars or thread inserts, then they and the lines that point at them take that kind; nothing else changes', () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'swapyard-migration-'));
    try {
      const before = path.join(dir, 'drizzle');
      fs.cpSync(migrations, before, { recursive: true });
      const journalFile = path.join(before, 'meta', '_journal.json');
      const journal = JSON.parse(fs.readFileSync(journalFile, 'utf8'));
      const at = journal.entries.findIndex((e: { tag: string }) => e.tag.endsWith('_catalogue_kinds_and_changes'));
      fs.writeFileSync(journalFile, JSON.stringify({ ...journal, entries: journal.entries.slice(0, at) }));
      const db = openDb(path.join(dir, 'old.db'));
      migrate(db, { migrationsFolder: before });

      const now = Date.now();
      const sqlite = db.$client;
      const insertPart = sqlite.prepare(
        `insert into parts (slug, kind, name, maker, part_numbers, specs, came_on, created_at, updated_at)
         values (?, ?, ?, 'Northgate Fabrication', ?, ?, '[]', ?, ?)`,
      );
      const part = (slug: string, kind: string, name: string, number: string) =>
        Number(
          insertPart.run(slug, kind, name, JSON.stringify([number]), JSON.stringify({ thread: 'M12×1.5' }), now, now)
            .lastInsertRowid,
        );
      const bolt = part('bolt', 'hardware', 'Wheel bolt M12×1.5 × 36 mm (set of 10)', 'NGF-WB-1236');
      const bar = part('bar', 'hardware', 'H40 rear anti-roll bar, 22 mm', 'H40-551-022');
      part('insert', 'hardware', 'Solid thread insert M12×1.5', 'NGF-TI-1218');
      const radial = part('radial', 'hardware', 'Radial caliper bolt M10×1.25 × 45 mm', 'NGF-RB-1045');
      const caliper = part('caliper', 'caliper', 'Vela wheel bolt caliper', 'OV-355-104-L');

      const userId = sqlite
        .prepare(
          "insert into users (provider, provider_id, login, created_at, updated_at) values ('github', 'x', 'camber_kai', ?, ?)",
        )
        .run(now, now).lastInsertRowid;
      const chassisId = sqlite
        .prepare(
          `insert into chassis (slug, make, model, code, year_from, lug_count, pcd_mm, centre_bore_mm, wheel_bolt_thread,
             stock_wheel, stock_brakes, created_at, updated_at)
           values ('halden-h31', 'Halden', 'H31', 'H31', 1991, 5, 112, 66.6, 'M12x1.5', '{}', '{}', ?, ?)`,
        )
        .run(now, now).lastInsertRowid;
      const swapId = sqlite
        .prepare(
          "insert into swaps (slug, chassis_id, axle, category, author_id, created_at, updated_at) values ('s', ?, 'front', 'brakes', ?, ?, ?)",
        )
        .run(chassisId, userId, now, now).lastInsertRowid;
      const line = (partId: number | undefined, name: string) => ({
        ...(partId ? { partId } : {}),
        role: name,
        kind: 'hardware' as const,
        name,
        maker: 'Northgate Fabrication',
        partNumbers: [],
        cameOn: [],
        quantity: 2,
        notes: '',
      });
      const data = swapData('Wheel bolts and a bar', {
        parts: [
          line(bolt, 'Longer wheel bolts'),
          line(undefined, 'Wheel bolt, no catalogue entry'),
          line(bar, 'Bar'),
          line(radial, 'Radial bolts'),
        ],
      });
      const revisionId = sqlite
        .prepare(
          "insert into revisions (swap_id, number, author_id, status, data, created_at, updated_at) values (?, 1, ?, 'approved', ?, ?, ?)",
        )
        .run(swapId, userId, JSON.stringify(data), now, now).lastInsertRowid;

      migrate(db, { migrationsFolder: migrations });

      const kinds = Object.fromEntries(
        db
          .select()
          .from(parts)
          .all()
          .map((p) => [p.slug, p.kind]),
      );
      expect(kinds).toEqual({
        bolt: 'wheel_fastener',
        bar: 'anti_roll_bar',
        insert: 'thread_insert',
        radial: 'hardware',
        caliper: 'caliper',
      });
      expect(
        db
          .select()
          .from(parts)
          .all()
          .find((p) => p.id === bolt)!.partNumbers,
      ).toEqual(['NGF-WB-1236']);
      const after = db
        .select()
        .from(revisions)
        .all()
        .find((r) => r.id === Number(revisionId))!.data;
      expect(after.parts.map((p) => [p.name, p.kind, p.partId ?? null])).toEqual([
        ['Longer wheel bolts', 'wheel_fastener', bolt],
        ['Wheel bolt, no catalogue entry', 'hardware', null],
        ['Bar', 'anti_roll_bar', bar],
        ['Radial bolts', 'hardware', radial],
      ]);
      // everything else in the record is as it was
      expect({ ...after, parts: [] }).toEqual({ ...data, parts: [] });
      expect(after.parts.map((p) => p.quantity)).toEqual([2, 2, 2, 2]);
      // the part-line lookup the triggers keep still points each line at its part
      const lookups = sqlite
        .prepare('select position, part_id from revision_parts where revision_id = ? order by position')
        .all(revisionId);
      expect(lookups).toEqual([
        { position: 0, part_id: bolt },
        { position: 2, part_id: bar },
        { position: 3, part_id: radial },
      ]);
      expect(caliper).toBeGreaterThan(0);
      closeDb(db);
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });
});
