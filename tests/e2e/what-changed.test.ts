import { execFile } from 'node:child_process';
import path from 'node:path';
import { promisify } from 'node:util';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { startServer, type RunningServer } from './support/server';
import { launchBrowser } from './support/browser';
import { signInContext, watchedPage, type SignedIn } from './support/watched-page';

// The "what changed" view of a correction, on the review desk and on the sheet's comparison page:
// rows paired by what they are, in the trade's words, nothing internal shown.

const root = path.resolve(import.meta.dirname, '../..');
const run = promisify(execFile);

let server: RunningServer;
let browser: Browser;
let moderator: SignedIn;
let slug: string;
let correctionId: number;

const fasteners = [
  { id: 'caliper-bolts', kind: 'caliper_mount', label: 'Caliper to bracket', thread: 'M12x1.5' },
  { id: 'bracket-bolts', kind: 'bracket_mount', label: 'Bracket to knuckle', thread: 'M12x1.5' },
  { id: 'banjo', kind: 'banjo', label: 'Hose to caliper', thread: 'M10x1' },
  { id: 'wheel-bolts', kind: 'wheel', label: 'Wheel to hub', thread: 'M12x1.5' },
];
const torque = [
  { fastenerId: 'caliper-bolts', nm: 85 },
  { fastenerId: 'bracket-bolts', nm: 95 },
  { fastenerId: 'banjo', nm: 9 },
  { fastenerId: 'wheel-bolts', nm: 110 },
];
const record = {
  schemaVersion: 2,
  title: 'Vela four-piston calipers on the Halden H31 front',
  summary: 'Bolt-on with a bracket.',
  parts: [
    {
      role: 'Front caliper',
      kind: 'caliper',
      name: 'Vela four-piston fixed caliper',
      maker: 'Orsino',
      partNumbers: ['OV-355-104-L'],
      quantity: 2,
    },
    { role: 'Rotor', kind: 'rotor', name: 'Regent vented rotor', maker: 'Tamsin', partNumbers: ['TR-330-28'], quantity: 2 },
  ],
  adapter: { name: 'H31 radial caliper bracket', maker: 'Northgate Fabrication', partNumber: 'NF-H31-VB' },
  rotors: [{ axle: 'front', diameterMm: 330, thicknessMm: 28, vented: true }],
  fasteners,
  torque,
  wheel: {
    minDiameterIn: 16,
    caliperRadialProjectionMm: 12,
    caliperOutboardMm: 30,
    testedWheels: [{ diameterIn: 16, widthIn: 7, offsetMm: 38, outcome: 'fits', radialClearanceMm: 6 }],
  },
  costs: [{ route: 'as_built', item: 'Used calipers', amountMinor: 32000 }],
  tools: ['Torque wrench, 20–120 N·m'],
};

async function setRole(login: string, role: string) {
  await run(process.execPath, ['--import', 'tsx', 'server/auth/user-role-cli.ts', login, role], {
    cwd: root,
    env: { ...process.env, DATABASE_URL: path.join(server.dir, 'e2e.db') },
  });
}

beforeAll(async () => {
  server = await startServer();
  browser = await launchBrowser();
  const author = await signInContext(browser, server.url, 'rivet_rosa');
  await (await signInContext(browser, server.url, 'gauge_mo')).context.close();
  await setRole('gauge_mo', 'moderator');
  moderator = await signInContext(browser, server.url, 'gauge_mo');

  const created = (await author.api.send('POST', '/api/submissions', {
    newChassis: {
      make: 'Halden',
      model: 'H31',
      code: 'H31',
      yearFrom: 1991,
      yearTo: 1999,
      lugCount: 5,
      pcdMm: 112,
      centreBoreMm: 66.6,
      wheelBoltThread: 'M12x1.5',
    },
    axle: 'front',
    category: 'brakes',
    data: record,
    body: 'Bolt the bracket on first.\n\nTorque the wheel bolts to 110 N·m.',
  })) as { id: number; swapSlug: string };
  slug = created.swapSlug;
  await author.api.send('POST', `/api/submissions/${created.id}/submit`);
  await moderator.api.send('POST', `/api/review/${created.id}/approve`, { note: '' });

  // a correction by another member: a guide-pin line put first, the torque lines in another order,
  // the wheel-bolt torque changed, a wheel added and a part's quantity changed
  const corrector = await signInContext(browser, server.url, 'camber_kai');
  const correction = (await corrector.api.send('POST', '/api/submissions', {
    swapSlug: slug, changeNote: 'Re-measured on the car; the figures now match the parts.',
    data: {
      ...record,
      parts: [{ ...record.parts[1], quantity: 4 }, record.parts[0]],
      fasteners: [{ id: 'guide-pins', kind: 'guide_pin', label: 'Guide pins', thread: 'M8x1.25' }, ...fasteners],
      torque: [
        { fastenerId: 'guide-pins', nm: 28 },
        ...torque.map((t) => (t.fastenerId === 'wheel-bolts' ? { ...t, nm: 120 } : t)).reverse(),
      ],
      wheel: {
        ...record.wheel,
        testedWheels: [
          { diameterIn: 17, widthIn: 7.5, offsetMm: 35, outcome: 'fits', radialClearanceMm: 14 },
          ...record.wheel.testedWheels,
        ],
      },
    },
    body: 'Bolt the bracket on first.\n\nTorque the wheel bolts to 120 N·m.',
  })) as { id: number };
  correctionId = correction.id;
  await corrector.api.send('POST', `/api/submissions/${correctionId}/submit`);
  await author.context.close();
  await corrector.context.close();
}, 90_000);

afterAll(async () => {
  await moderator?.context.close();
  await browser?.close();
  await server?.stop();
});

/** What the reader sees, and what the view must never show. */
async function expectTradeWords(page: Page) {
  const view = page.getByTestId('revision-changes');
  await view.waitFor();
  const shown = await view.innerText();
  // the wheel bolts changed from 110 to 120 N·m; nothing else about torque changed
  const wheelRow = view.locator('li', { hasText: 'Wheel to hub' });
  await expect.poll(() => wheelRow.count()).toBe(1);
  const wheelText = (await wheelRow.innerText()).replace(/\s+/g, ' ');
  expect(wheelText).toMatch(/Changed Wheel to hub Wheel bolts or nuts Torque was 110 N·m now 120 N·m/i);
  expect(await view.locator('[data-row-change]', { hasText: 'Hose to caliper' }).count()).toBe(0);
  expect(await view.locator('[data-row-change="added"]', { hasText: 'Guide pins' }).count()).toBe(1);
  expect(await view.locator('[data-row-change="added"]', { hasText: 'Tested wheel 17″ × 7.5″, ET35' }).count()).toBe(1);
  const rotor = (await view.locator('[data-row-change="changed"]', { hasText: 'Regent vented rotor' }).innerText()).replace(
    /\s+/g,
    ' ',
  );
  expect(rotor).toMatch(/Quantity was 2 now 4/i);
  expect(shown).toContain('Paragraph reworded');
  // nothing internal: no field paths, ids or list positions
  for (const internal of ['torque.', 'parts.', 'partId', 'fastenerId', 'wheel-bolts', 'guide-pins', 'nm ', 'undefined'])
    expect(shown).not.toContain(internal);
  // not a two-column table, and no word broken mid-word
  expect(await view.locator('table').count()).toBe(0);
  const breakAll = await view.evaluate(
    (el) => [el, ...el.querySelectorAll('*')].filter((e) => getComputedStyle(e).wordBreak === 'break-all').length,
  );
  expect(breakAll).toBe(0);
}

describe('what changed', () => {
  it('when a moderator opens a correction, then the review page shows what it changes in the trade’s words', async () => {
    const { page, errors } = await watchedPage(moderator.context);
    await page.goto(`${server.url}/review/${correctionId}`);
    await page.getByRole('heading', { name: /What this correction changes in revision 1/ }).waitFor();
    await expectTradeWords(page);
    expect(errors).toEqual([]);
    await page.close();
  });

  it('when the correction is approved and a reader compares the revisions on a phone, then the same view fits the screen', async () => {
    await moderator.api.send('POST', `/api/review/${correctionId}/approve`, { note: '' });
    const context = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    // asked the other way round, the older revision is still the one things changed from
    await page.goto(`${server.url}/swaps/${slug}/compare?a=2&b=1`);
    await page.getByRole('heading', { level: 1, name: 'What changed from revision 1 to 2' }).waitFor();
    await expectTradeWords(page);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    expect(errors).toEqual([]);
    await context.close();
  });
});
