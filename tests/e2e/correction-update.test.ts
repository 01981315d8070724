import { execFile } from 'node:child_process';
import path from 'node:path';
import { promisify } from 'node:util';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { startServer, type RunningServer } from './support/server';
import { launchBrowser } from './support/browser';
import { signInContext, watchedPage, type SignedIn } from './support/watched-page';

// Two members correct the same approved revision; the first correction is approved. The desk shows the
// moderator that the second is behind and what the newer approval changed; its author merges, picking
// the wheel-bolt torque both of them changed, and the approval then keeps every change.

const root = path.resolve(import.meta.dirname, '../..');
const run = promisify(execFile);

let server: RunningServer;
let browser: Browser;
let moderator: SignedIn;
let author: SignedIn;
let slug: string;
let behindId: number;

const fasteners = [
  { id: 'bracket-bolts', kind: 'bracket_mount', label: 'Bracket to knuckle', thread: 'M12x1.5' },
  { id: 'wheel-bolts', kind: 'wheel', label: 'Wheel to hub', thread: 'M12x1.5' },
];
const record = (wheelNm: number, title = 'Vela four-piston calipers on the Halden H31 front') => ({
  schemaVersion: 2,
  title,
  parts: [
    {
      role: 'Front caliper',
      kind: 'caliper',
      name: 'Vela four-piston fixed caliper',
      maker: 'Orsino',
      partNumbers: ['OV-355-104-L'],
      quantity: 2,
    },
  ],
  adapter: { name: 'H31 radial caliper bracket', maker: 'Northgate Fabrication', partNumber: 'NF-H31-VB' },
  rotors: [{ axle: 'front', diameterMm: 330, thicknessMm: 28, vented: true }],
  fasteners,
  torque: [
    { fastenerId: 'bracket-bolts', nm: 95 },
    { fastenerId: 'wheel-bolts', nm: wheelNm },
  ],
  wheel: { minDiameterIn: 16, caliperRadialProjectionMm: 12, caliperOutboardMm: 30 },
});

type View = { id: number; swapSlug: string; data: { title: string; torque: { fastenerId: string; nm: number }[] } };

async function setRole(login: string, role: string) {
  await run(process.execPath, ['--import', 'tsx', 'server/auth/user-role-cli.ts', login, role], {
    cwd: root,
    env: { ...process.env, DATABASE_URL: path.join(server.dir, 'e2e.db') },
  });
}

beforeAll(async () => {
  server = await startServer();
  browser = await launchBrowser();
  const owner = await signInContext(browser, server.url, 'rivet_rosa');
  await (await signInContext(browser, server.url, 'gauge_mo')).context.close();
  await setRole('gauge_mo', 'moderator');
  moderator = await signInContext(browser, server.url, 'gauge_mo');

  const created = (await owner.api.send('POST', '/api/submissions', {
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
    data: record(110),
  })) as View;
  slug = created.swapSlug;
  await owner.api.send('POST', `/api/submissions/${created.id}/submit`);
  await moderator.api.send('POST', `/api/review/${created.id}/approve`, { note: '' });

  // two corrections of revision 1: the first is approved, the second changed the same torque differently
  const first = await signInContext(browser, server.url, 'camber_kai');
  const approvedFirst = (await first.api.send('POST', '/api/submissions', { swapSlug: slug, changeNote: 'Re-measured on the car; the figures now match the parts.', data: record(120) })) as View;
  await first.api.send('POST', `/api/submissions/${approvedFirst.id}/submit`);
  author = await signInContext(browser, server.url, 'pistonpaul');
  const second = (await author.api.send('POST', '/api/submissions', {
    swapSlug: slug, changeNote: 'Re-measured on the car; the figures now match the parts.',
    data: record(115, 'Vela four-piston calipers, Halden H31 front axle'),
  })) as View;
  behindId = second.id;
  await author.api.send('POST', `/api/submissions/${behindId}/submit`);
  await moderator.api.send('POST', `/api/review/${approvedFirst.id}/approve`, { note: '' });
  await owner.context.close();
  await first.context.close();
}, 90_000);

afterAll(async () => {
  await moderator?.context.close();
  await author?.context.close();
  await browser?.close();
  await server?.stop();
});

describe('a correction behind the current revision', () => {
  it('when a moderator opens it, then the desk says the record moved on, shows what the newer approval changed and offers only sending it back', async () => {
    const { page, errors } = await watchedPage(moderator.context);
    await page.goto(`${server.url}/review/${behindId}`);
    await page.getByRole('heading', { name: 'The record moved on' }).waitFor();
    const newer = page.locator('section', {
      has: page.getByRole('heading', { name: 'What revision 2 changed since revision 1' }),
    });
    expect((await newer.locator('li', { hasText: 'Wheel to hub' }).innerText()).replace(/\s+/g, ' ')).toMatch(
      /Torque was 110 N·m now 120 N·m/i,
    );
    await expect.poll(() => page.getByRole('radio', { name: /Publish/ }).isDisabled()).toBe(true);
    expect(await page.getByRole('radio', { name: /Send back/ }).isChecked()).toBe(true);
    await page.getByRole('button', { name: 'Send back for rework', exact: true }).click();
    await page.getByTestId('cannot-decide').getByText('Sent back to the author').waitFor();
    expect(errors).toEqual([]);
    await page.close();
  });

  it('when its author brings it up to date and picks the newer torque, then the approval keeps both corrections', async () => {
    const { page, errors } = await watchedPage(author.context);
    await page.goto(`${server.url}/submissions/${behindId}/edit`);
    await page.getByTestId('behind-current').getByRole('link', { name: 'Bring it up to date' }).click();
    await page.getByRole('heading', { level: 1, name: 'Bring your correction up to date' }).waitFor();
    const conflict = page.locator('[data-conflict]');
    await expect.poll(() => conflict.count()).toBe(1);
    const shown = (await conflict.innerText()).replace(/\s+/g, ' ');
    expect(shown).toMatch(/Wheel to hub/);
    expect(shown).toMatch(/revision 2 120 N·m/i);
    expect(shown).toMatch(/yours 115 N·m/i);
    // nothing internal reaches the page
    for (const internal of ['torque[', 'wheel-bolts', 'data.'])
      expect(await page.locator('main').innerText()).not.toContain(internal);
    const apply = page.getByRole('button', { name: 'Bring it up to date' });
    expect(await apply.isDisabled()).toBe(true);
    await conflict.getByRole('radio', { name: 'Keep revision 2’s' }).check();
    await apply.click();
    await page.waitForURL((u) => u.pathname === `/submissions/${behindId}/edit`);
    await page.getByRole('heading', { level: 1 }).waitFor();
    expect(await page.getByTestId('behind-current').count()).toBe(0);
    expect(errors).toEqual([]);
    await page.close();

    await author.api.send('POST', `/api/submissions/${behindId}/submit`);
    await moderator.api.send('POST', `/api/review/${behindId}/approve`, { note: '' });
    const sheet = (await moderator.api.get(`/api/swaps/${slug}`)) as { revision: View['data'] & { data: View['data'] } };
    expect(sheet.revision.data.title).toBe('Vela four-piston calipers, Halden H31 front axle');
    expect(sheet.revision.data.torque.find((t) => t.fastenerId === 'wheel-bolts')!.nm).toBe(120);
  });
});
