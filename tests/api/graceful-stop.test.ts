import fs from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import Database from 'better-sqlite3';
import sharp from 'sharp';
import { closeDb, migrateDb, openDb } from '../../server/db/client';
import { freePort } from '../e2e/support/server';
import { addUser } from './support/auth-helpers';
import { addChassis, swapRecord } from './support/swap-fixtures';
import { sendJson, signedInClient, startChildServer, type ChildServer, type CookieClient } from './support/child-server';
import { startSmtp } from './support/smtp';

// SIGTERM to the real server process: it stops accepting, lets requests in flight finish, lets a
// delivery in progress record its result, and closes the database; mail still due goes out after a restart.

const cleanup: (() => unknown)[] = [];
afterEach(async () => {
  for (const fn of cleanup.splice(0).reverse()) await fn();
});

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** A database with a chassis and a member, and a folder for the server's files. */
function prepare() {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'swapyard-stop-'));
  cleanup.push(() => fs.rmSync(dir, { recursive: true, force: true }));
  const file = path.join(dir, 'server.db');
  const db = openDb(file);
  migrateDb(db);
  const chassisId = addChassis(db).id;
  addUser(db, 'rivet_rosa');
  closeDb(db);
  const read = <T>(sql: string) => {
    const ro = new Database(file, { readonly: true });
    try {
      return ro.prepare(sql).all() as T[];
    } finally {
      ro.close();
    }
  };
  return { dir, chassisId, read };
}

async function start(dir: string, port: number, env: Record<string, string> = {}) {
  const server = await startChildServer(dir, port, env);
  cleanup.push(async () => {
    if (server.child.exitCode === null && server.child.signalCode === null) {
      server.child.kill('SIGKILL');
      await server.exited;
    }
  });
  return server;
}

async function newDraft(client: CookieClient, chassisId: number): Promise<number> {
  const res = await sendJson(client, 'POST', '/api/submissions', {
    chassisId,
    axle: 'front',
    category: 'brakes',
    data: swapRecord(),
  });
  expect(res.status).toBe(201);
  return ((await res.json()) as { id: number }).id;
}

const stopped = async (server: ChildServer) => {
  server.child.kill('SIGTERM');
  return server.exited;
};

describe('stopping the server', () => {
  it('when SIGTERM arrives while a photo is still uploading, then new connections are refused, the upload completes and is stored, and the process exits 0', async () => {
    const { dir, chassisId, read } = prepare();
    const port = await freePort();
    const server = await start(dir, port);
    const rosa = await signedInClient(server.base, 'rivet_rosa');
    const id = await newDraft(rosa, chassisId);

    const photo = await sharp({ create: { width: 320, height: 240, channels: 3, background: { r: 29, g: 77, b: 58 } } })
      .png()
      .toBuffer();
    const boundary = 'swapyard-stop-test-boundary';
    const body = Buffer.concat([
      Buffer.from(
        `--${boundary}\r\nContent-Disposition: form-data; name="photos"; filename="caliper.png"\r\nContent-Type: image/png\r\n\r\n`,
      ),
      photo,
      Buffer.from(`\r\n--${boundary}--\r\n`),
    ]);
    const upload = http.request(`${server.base}/api/submissions/${id}/photos`, {
      method: 'POST',
      headers: {
        cookie: rosa.cookie(),
        'x-csrf-token': rosa.csrf,
        'content-type': `multipart/form-data; boundary=${boundary}`,
        'content-length': body.length,
      },
    });
    const answered = new Promise<{ status: number; text: string }>((resolve, reject) => {
      upload.on('response', (res) => {
        let text = '';
        res.on('data', (c) => (text += c));
        res.on('end', () => resolve({ status: res.statusCode!, text }));
      });
      upload.on('error', reject);
    });
    // half the photo is on its way when the signal comes
    upload.write(body.subarray(0, body.length >> 1));
    await sleep(300);
    server.child.kill('SIGTERM');
    await sleep(300);
    await expect(fetch(`${server.base}/api/health`)).rejects.toThrow();
    upload.end(body.subarray(body.length >> 1));

    const res = await answered;
    expect(res.status, res.text).toBe(201);
    expect(await server.exited).toBe(0);
    // closed cleanly: the write-ahead log was checkpointed and removed
    expect(fs.existsSync(path.join(dir, 'server.db-wal'))).toBe(false);
    const rows = read<{ file_id: string }>('select file_id from revision_photos');
    expect(rows).toHaveLength(1);
    expect(fs.readdirSync(path.join(dir, 'uploads')).sort()).toEqual([rows[0].file_id, `${rows[0].file_id}_t`]);
  }, 90_000);

  it('when SIGTERM arrives while a message is being delivered, then the delivery finishes and is recorded, and a restart sends nothing twice', async () => {
    const { dir, chassisId, read } = prepare();
    let dataStarted!: () => void;
    const started = new Promise<void>((resolve) => (dataStarted = resolve));
    const smtp = await startSmtp({ dataDelayMs: 1500, onDataStart: () => dataStarted() });
    cleanup.push(() => smtp.close());
    const port = await freePort();
    const env = { SMTP_URL: `smtp://127.0.0.1:${smtp.port}`, MAIL_RETRY_MS: '100' };
    const server = await start(dir, port, env);
    const rosa = await signedInClient(server.base, 'rivet_rosa');
    const id = await newDraft(rosa, chassisId);
    expect((await sendJson(rosa, 'POST', `/api/submissions/${id}/submit`)).status).toBe(200);

    await started; // the mail server has the message and is slow to say it took it
    expect(await stopped(server)).toBe(0);
    expect(read('select status, attempts from mail_outbox')).toEqual([{ status: 'sent', attempts: 1 }]);
    expect(smtp.received).toHaveLength(1);

    const again = await start(dir, port, env);
    await sleep(1000);
    expect(smtp.received).toHaveLength(1);
    expect(await stopped(again)).toBe(0);
  }, 90_000);

  it('when the server stops while the mail server is down, then the message is delivered once after a restart', async () => {
    const { dir, chassisId, read } = prepare();
    const smtpPort = await freePort(); // nothing listens yet
    const port = await freePort();
    const env = { SMTP_URL: `smtp://127.0.0.1:${smtpPort}`, MAIL_RETRY_MS: '200' };
    const server = await start(dir, port, env);
    const rosa = await signedInClient(server.base, 'rivet_rosa');
    const id = await newDraft(rosa, chassisId);
    expect((await sendJson(rosa, 'POST', `/api/submissions/${id}/submit`)).status).toBe(200);
    await expect
      .poll(() => read<{ status: string }>('select status from mail_outbox')[0]?.status, { timeout: 10_000 })
      .toBe('retrying');
    expect(await stopped(server)).toBe(0);

    const smtp = await startSmtp({ port: smtpPort });
    cleanup.push(() => smtp.close());
    const again = await start(dir, port, env);
    await expect
      .poll(() => read<{ status: string }>('select status from mail_outbox')[0].status, { timeout: 15_000 })
      .toBe('sent');
    const [row] = read<{ message_id: string }>('select message_id from mail_outbox');
    await sleep(500);
    expect(smtp.received.map((m) => m.messageId)).toEqual([row.message_id]);
    expect(await stopped(again)).toBe(0);
  }, 90_000);
});
