import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser } from './support/browser';
import { startServer, type RunningServer } from './support/server';
import { closeDb, openDb, type Db } from '../../server/db/client';
import { users } from '../../server/db/schema/index';
import { addChassis, addPart } from '../api/support/swap-fixtures';
import { addSwap, catalogueLine, swapData } from '../api/support/swap-rows';

// The interchange graph in Chromium, over rows arranged here: one caliper recorded twice (they share a
// number, the first names an older stamp in its notes), a catalogue adapter, and swaps on two chassis.

let server: RunningServer;
let browser: Browser;
let db: Db;
const ids = {} as Record<'velaA' | 'velaB' | 'bracket', number>;

beforeAll(async () => {
  server = await startServer();
  browser = await launchBrowser();
  db = openDb(path.join(server.dir, 'e2e.db'));
  const now = new Date();
  const author = db
    .insert(users)
    .values({ provider: 'github', providerId: 'demo-rivet_rosa', login: 'rivet_rosa', createdAt: now, updatedAt: now })
    .returning()
    .get().id;
  const h31 = addChassis(db, 'halden-h31').id;
  const regent = addChassis(db, 'tamsin-regent', {
    make: 'Tamsin',
    model: 'Regent',
    code: 'TR2',
    yearFrom: 1997,
    yearTo: 2004,
  }).id;
  ids.velaA = addPart(db, 'vela-caliper-l', { notes: 'Early ones carry the stamp OV-355-099-L on the bridge.' }).id;
  ids.velaB = addPart(db, 'vela-caliper-l-late', {
    name: 'Vela four-piston caliper, left, late',
    partNumbers: ['OV-355-110-L', 'OV-355-104-L'],
    cameOn: ['Orsino Vela 2.5 (1998–2001)'],
  }).id;
  ids.bracket = addPart(db, 'nf-h31-bracket', {
    kind: 'adapter',
    name: 'H31 radial caliper bracket',
    maker: 'Northgate Fabrication',
    partNumbers: ['NF-H31-VB'],
    specs: {},
    cameOn: [],
  }).id;
  const onH31 = swapData('Vela calipers on the H31', {
    parts: [
      catalogueLine(ids.velaA, 'caliper', 'Vela caliper', ['OV-355-104-L']),
      catalogueLine(ids.bracket, 'adapter', 'H31 radial caliper bracket', ['NF-H31-VB']),
    ],
  });
  const onRegent = swapData('Late Vela calipers on the Regent', {
    parts: [catalogueLine(ids.velaB, 'caliper', 'Vela caliper', ['OV-355-110-L'])],
  });
  addSwap(db, { slug: 'h31-vela-front', chassisId: h31, authorId: author, revisions: [{ status: 'approved', data: onH31 }] });
  addSwap(db, {
    slug: 'regent-vela-front',
    chassisId: regent,
    authorId: author,
    revisions: [{ status: 'approved', data: onRegent }],
  });
  addSwap(db, {
    slug: 'h31-in-review',
    chassisId: h31,
    authorId: author,
    revisions: [{ status: 'in_review', data: swapData('Still on the desk', { parts: onH31.parts }) }],
  });
});
afterAll(async () => {
  closeDb(db);
  await browser?.close();
  await server?.stop();
});

async function open(url: string, width: number) {
  const context = await browser.newContext({ viewport: { width, height: 900 } });
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  page.on('console', (m) => m.type() === 'error' && errors.push(m.text()));
  await page.goto(`${server.url}${url}`);
  return { page, errors, close: () => context.close() };
}

describe('the interchange graph in the browser', () => {
  it('when a visitor opens a part page, then it lists every chassis approved swaps fit the part to, with the adapter, and the records of the same part', async () => {
    const { page, errors, close } = await open(`/parts/${ids.velaA}`, 1280);
    const fits = page.getByRole('list', { name: 'Chassis it fits' });
    await fits.waitFor();
    const cards = fits.getByRole('listitem').filter({ has: page.getByRole('heading') });
    expect(await cards.count()).toBe(2);
    const h31 = cards.filter({ hasText: 'Halden H31' });
    expect(await h31.getByRole('link', { name: 'Vela calipers on the H31' }).count()).toBe(1);
    expect(await h31.getByRole('link', { name: 'H31 radial caliper bracket' }).count()).toBe(1);
    expect(
      await cards.filter({ hasText: 'Tamsin Regent' }).getByRole('link', { name: 'Late Vela calipers on the Regent' }).count(),
    ).toBe(1);
    expect(await fits.innerText()).not.toContain('Still on the desk');
    // the other record's vehicles and numbers, and the older stamp
    expect(await page.getByRole('list', { name: 'Vehicles it came on' }).innerText()).toContain('Orsino Vela 2.5 (1998–2001)');
    expect(
      await page
        .getByRole('listitem')
        .filter({ hasText: /^OV-355-099-L/ })
        .innerText(),
    ).toContain('stamp from notes');
    await page.getByRole('link', { name: 'Vela four-piston caliper, left, late' }).click();
    await page.waitForURL(new RegExp(`/parts/${ids.velaB}$`));
    await page.getByRole('list', { name: 'Chassis it fits' }).waitFor();
    expect(errors).toEqual([]);
    await close();
  });

  it('when a visitor types an older stamp in lower case with spaces on a phone, then "where else" finds both records, the other numbers and every chassis', async () => {
    const { page, errors, close } = await open('/where-else', 390);
    await page.getByRole('textbox', { name: 'Part number' }).fill('ov 355 099 l');
    await page.getByRole('button', { name: 'Find' }).click();
    const reaches = page.getByRole('list', { name: 'Chassis it reaches' });
    await reaches.waitFor();
    expect(new URL(page.url()).searchParams.get('number')).toBe('ov 355 099 l');
    expect(await page.getByRole('heading', { name: 'The part, recorded 2 times' }).count()).toBe(1);
    const text = await reaches.innerText();
    expect(text).toContain('Halden H31');
    expect(text).toContain('Tamsin Regent');
    expect(await page.getByText('OV-355-110-L').count()).toBeGreaterThan(0);
    // the page is as wide as the phone: nothing scrolls sideways
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await reaches.getByRole('link', { name: 'Late Vela calipers on the Regent' }).click();
    await page.waitForURL(/\/swaps\/regent-vela-front$/);
    expect(errors).toEqual([]);
    await close();
  });

  it('when a number nobody recorded is typed, then the page says so', async () => {
    const { page, errors, close } = await open('/where-else?number=ZZ-000', 1280);
    await page.getByText('No catalogue part carries').waitFor();
    expect(errors).toEqual([]);
    await close();
  });

  it('when a visitor opens a chassis page, then its donor parts are grouped by kind with the swaps that show how', async () => {
    const { page, errors, close } = await open('/chassis/halden-h31', 1280);
    const calipers = page.getByRole('list', { name: 'Caliper donor parts' });
    await calipers.waitFor();
    expect(await calipers.innerText()).toContain('Vela calipers on the H31');
    expect(await page.getByRole('list', { name: 'Adapter bracket donor parts' }).innerText()).toContain(
      'H31 radial caliper bracket',
    );
    expect(errors).toEqual([]);
    await close();
  });
});
