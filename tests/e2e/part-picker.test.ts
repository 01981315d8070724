import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { startServer, type RunningServer } from './support/server';
import { launchBrowser } from './support/browser';
import { openSubmitForm } from './support/sign-in';
import { closeDb, openDb } from '../../server/db/client';
import { addChassis, addPart } from '../api/support/swap-fixtures';

// A part line starts from the catalogue: a member finds the part by typing part of its number, or types a
// new part that the catalogue already holds and is offered the existing one.

let server: RunningServer;
let browser: Browser;

beforeAll(async () => {
  server = await startServer();
  const db = openDb(path.join(server.dir, 'e2e.db'));
  addChassis(db);
  addPart(db, 'vela-caliper-l');
  addPart(db, 'ngf-wheel-bolt-41', {
    kind: 'wheel_fastener',
    name: 'Wheel bolt M12×1.5 × 41 mm, 60° cone seat (set of 10)',
    maker: 'Northgate Fabrication',
    partNumbers: ['NGF-WB-1241'],
    specs: { thread: 'M12×1.5', lengthMm: 41 },
    cameOn: [],
  });
  addPart(db, 'ngf-wheel-bolt-36', {
    kind: 'wheel_fastener',
    name: 'Wheel bolt M12×1.5 × 36 mm, 60° cone seat (set of 10)',
    maker: 'Northgate Fabrication',
    partNumbers: ['NGF-WB-1236'],
    specs: { thread: 'M12×1.5', lengthMm: 36 },
    cameOn: [],
  });
  closeDb(db);
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

describe('picking a catalogue part in the submission form', () => {
  it('when a member types part of a number and picks the part, then the line is filled from the catalogue; a typed duplicate is offered as the existing part', async () => {
    const { context, page, errors } = await openSubmitForm(browser, server.url, 'camber_kai');
    const part1 = page.getByRole('group', { name: 'Part 1' });
    const picker = part1.getByRole('combobox', { name: 'Find it in the catalogue' });
    // the form settles (the device copy of an unsaved form is read back) before anything is typed
    await page.waitForLoadState('networkidle');
    await picker.click();
    await picker.pressSequentially('ngf wb 1241');
    const option = part1.getByRole('option', { name: /Wheel bolt M12×1\.5 × 41 mm/ });
    await option.waitFor();
    await picker.press('ArrowDown');
    await expect(picker.getAttribute('aria-expanded')).resolves.toBe('true');
    await option.click();
    await part1.getByText('From the catalogue:').waitFor();
    expect(await part1.getByRole('textbox', { name: 'Name', exact: true }).inputValue()).toMatch(/^Wheel bolt M12×1\.5 × 41 mm/);
    expect(await part1.getByRole('textbox', { name: 'Maker', exact: true }).inputValue()).toBe('Northgate Fabrication');
    expect(await part1.getByRole('textbox', { name: 'Part numbers', exact: true }).inputValue()).toBe('NGF-WB-1241');
    expect(await part1.getByRole('combobox', { name: 'Kind' }).inputValue()).toBe('wheel_fastener');

    // a second line typed by hand, its maker and number written differently from the catalogue's
    await page.getByRole('button', { name: 'Add a part' }).click();
    const part2 = page.getByRole('group', { name: 'Part 2' });
    await part2.getByRole('textbox', { name: 'Name', exact: true }).fill('Vela caliper I bought');
    await part2.getByRole('textbox', { name: 'Maker', exact: true }).fill('orsino');
    await part2.getByRole('textbox', { name: 'Part numbers', exact: true }).fill('ov 355.104/l');
    const offer = part2.getByRole('status').filter({ hasText: 'Already in the catalogue' });
    await offer.waitFor();
    expect(await offer.textContent()).toContain('OV-355-104-L');
    await offer.getByRole('button', { name: 'Use the existing part' }).click();
    await part2.getByText('From the catalogue:').waitFor();
    expect(await part2.getByRole('textbox', { name: 'Part numbers', exact: true }).inputValue()).toBe('OV-355-104-L');
    expect(await part2.getByRole('textbox', { name: 'Maker', exact: true }).inputValue()).toBe('Orsino');
    expect(errors).toEqual([]);
    await context.close();
  });
});
