import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import AxeBuilder from '@axe-core/playwright';
import type { Browser, Locator, Page } from 'playwright-core';
import { startServer, type RunningServer } from './support/server';
import { launchBrowser } from './support/browser';

let server: RunningServer;
let browser: Browser;

beforeAll(async () => {
  server = await startServer();
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

/** A text input by the start of its label (labels end in the unit shown, e.g. "Mass (kg)"). */
const field = (scope: Locator, label: string) =>
  scope.getByRole('textbox', { name: new RegExp(`^${label.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}`) });

async function fillCorner(panel: Locator, group: string, pistons: string, rotor: string, pad: string) {
  const fieldset = panel.getByRole('group', { name: group });
  await field(fieldset, 'Pistons per side').fill(pistons);
  await field(fieldset, 'Rotor Ø').fill(rotor);
  await field(fieldset, 'Pad height').fill(pad);
}

/** The checkbox follows the address bar, which updates a moment after the click. */
async function tick(panel: Locator, name: string) {
  const box = panel.getByRole('checkbox', { name });
  await box.click();
  await expect.poll(() => box.isChecked()).toBe(true);
}

const summaryOf = (panel: Locator) => panel.locator('[data-distribution-summary]');
const cell = (panel: Locator, state: string, row: string, column: number) =>
  panel
    .locator(`[data-distribution-table="${state}"]`)
    .getByRole('row', { name: new RegExp(`^${row}`) })
    .getByRole('cell')
    .nth(column)
    .innerText();

describe('brake distribution calculator', () => {
  it('when the worked-example car gets bigger front calipers, then the panel says where each axle locks first, draws it and keeps it in the URL', async () => {
    const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
    const page: Page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await page.goto(`${server.url}/tools#distribution`);
    const panel = page.locator('#distribution');
    await panel.getByRole('heading', { name: 'Brake distribution: which axle locks first' }).waitFor();

    // REFERENCES worked example (Limpert ch. 7): m 1450 kg, ψ 0.58, h 520 mm, L 2700 mm.
    const car = panel.getByRole('group', { name: 'The car, unladen' });
    await field(car, 'Mass').fill('1450');
    await field(car, 'Weight on the front axle').fill('58');
    await field(car, 'Centre-of-gravity height').fill('520');
    expect(await panel.locator('[data-waiting]').innerText()).toContain('wheelbase');
    await field(car, 'Wheelbase').fill('2700');
    const tyres = panel.getByRole('group', { name: 'Tyres' });
    await field(tyres, 'Front loaded radius').fill('300');
    await field(tyres, 'Rear loaded radius').fill('300');
    // Disc-brake textbook formula (REFERENCES): front share 65.93 % → 73.72 % with the swap.
    await fillCorner(panel, 'Stock front brakes', '54', '280', '50');
    await fillCorner(panel, 'Stock rear brakes', '38', '280', '40');

    // Φ 0.6593 on this car: both lock together at (0.6593 − 0.58) / (520 / 2700) = 0.41 g, rear first above.
    await expect
      .poll(() => summaryOf(panel).innerText())
      .toContain('The rear locks first above 0.41 g when unladen — check the rear valve and the brake balance');
    expect(await summaryOf(panel).getAttribute('data-attention')).toBe('true');

    await tick(panel, 'The front brakes');
    await fillCorner(panel, 'Swapped front brakes', '40, 44', '330', '55');
    await expect
      .poll(() => summaryOf(panel).innerText())
      .toContain(
        'The swap moves the balance toward the front (front share 65.9 % → 73.7 %): the rear still locks first above 0.82 g when unladen, later than before (above 0.41 g when unladen).',
      );
    expect(await summaryOf(panel).getAttribute('data-attention')).toBe('false');
    expect(await cell(panel, 'unladen', 'Both lock together', 0)).toBe('0.41 g');
    expect(await cell(panel, 'unladen', 'Both lock together', 1)).toBe('0.82 g');

    // The chart arrives with its own chunk: four curves, two lock-together dots, and a text version for screen readers.
    const chart = panel.locator('[data-adhesion-chart]');
    await chart.locator('svg .recharts-line').first().waitFor();
    expect(await chart.locator('svg .recharts-line').count()).toBe(4);
    expect(await chart.locator('svg .recharts-reference-dot').count()).toBe(2);
    const box = await chart.boundingBox();
    expect(box!.width).toBeGreaterThan(280);
    expect(box!.width).toBeLessThanOrEqual(390);
    const words = await panel.locator('figcaption').innerText();
    expect(words).toContain(
      'Before: the front locks first from 0.00 g to 0.41 g, then the rear locks first from 0.41 g to 1.00 g',
    );
    expect(words).toContain('After: the front locks first from 0.00 g to 0.82 g');

    const query = new URL(page.url()).searchParams;
    expect(query.get('d_m')).toBe('1450');
    expect(query.get('d_afp')).toBe('40, 44');

    expect(errors).toEqual([]);
    await context.close();
  });

  it('when a figure is impossible or the units change, then the field says why and the address keeps metric values', async () => {
    const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    const query = new URLSearchParams({ d_m: '1450', d_fs: '58', d_h: '520', d_wb: '2700', d_rf: '300', d_rr: '300' });
    for (const [axle, [pistons, rotor, pad]] of Object.entries({ bf: ['54', '280', '50'], br: ['38', '280', '40'] })) {
      query.set(`d_${axle}p`, pistons);
      query.set(`d_${axle}r`, rotor);
      query.set(`d_${axle}h`, pad);
    }
    await page.goto(`${server.url}/tools?${query}#distribution`);
    const panel = page.locator('#distribution');
    await summaryOf(panel).waitFor({ timeout: 15_000 });
    await expect.poll(() => summaryOf(panel).innerText()).toContain('The rear locks first above 0.41 g when unladen');
    const car = panel.getByRole('group', { name: 'The car, unladen' });

    // A share outside 0–100 % is refused beside its field, and the results say what to fix.
    await field(car, 'Weight on the front axle').fill('120');
    await expect.poll(() => car.getByRole('alert').innerText()).toBe('Enter a share between 0 and 100 %');
    expect(await panel.locator('[data-waiting]').innerText()).toContain('Fix the marked field');
    await field(car, 'Weight on the front axle').fill('58');
    await expect.poll(() => summaryOf(panel).count()).toBe(1);

    // Imperial: the mass reads in pounds (NIST SP 811: 1 lb = 0.45359237 kg), the address keeps kilograms.
    await page.getByRole('group', { name: 'Units for the calculators' }).getByRole('button', { name: 'Imperial' }).click();
    await expect.poll(() => field(car, 'Mass').inputValue()).toBe('3196.7');
    expect(await car.getByText('Mass (lb)').count()).toBe(1);
    await field(car, 'Mass').fill('3500');
    await expect.poll(() => new URL(page.url()).searchParams.get('d_m')).toBe('1587.573295');
    expect(errors).toEqual([]);
    await context.close();
  });

  it('when the swap puts bigger brakes on the rear of a loaded car, then the warning names both loads and the fix', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    // Axles given as torque per bar (as for drums): 80 / 20 N·m/bar stock, 80 / 45 after; laden 1800 kg, 52 %, 560 mm.
    const query = new URLSearchParams({
      d_m: '1450',
      d_fs: '58',
      d_h: '520',
      d_wb: '2700',
      d_laden: '1',
      d_ml: '1800',
      d_fsl: '52',
      d_hl: '560',
      d_rf: '300',
      d_rr: '300',
      d_bft: 'tpb',
      d_bfq: '80',
      d_brt: 'tpb',
      d_brq: '20',
      d_cr: '1',
      d_art: 'tpb',
      d_arq: '45',
    });
    await page.goto(`${server.url}/tools?${query}#distribution`);
    const panel = page.locator('#distribution');
    await summaryOf(panel).waitFor({ timeout: 15_000 });
    // Φ 0.64 after: unladen (0.64 − 0.58) / 0.192593 = 0.31 g; laden (0.64 − 0.52) / 0.207407 = 0.58 g.
    await expect
      .poll(() => summaryOf(panel).innerText())
      .toContain(
        'The swap moves the balance toward the rear (front share 80.0 % → 64.0 %): after it the rear locks first above 0.31 g when unladen and above 0.58 g when laden — fit a proportioning valve or keep the stock rear brakes.',
      );
    expect(await summaryOf(panel).getAttribute('data-attention')).toBe('true');
    expect(await cell(panel, 'laden', 'Rear locks first', 1)).toBe('above 0.58 g');
    expect(await cell(panel, 'laden', 'Rear locks first', 0)).toBe('never up to 1.00 g');

    // The chart switches between the loads; the reference band is named as a reference, not a verdict.
    const chart = panel.locator('[data-adhesion-chart]');
    await chart.locator('svg .recharts-line').first().waitFor();
    await panel.getByRole('button', { name: 'Laden', exact: true }).click();
    await expect.poll(() => panel.locator('figcaption').innerText()).toContain('Laden car.');
    expect(await panel.getByRole('button', { name: 'Laden', exact: true }).getAttribute('aria-pressed')).toBe('true');
    expect(await panel.innerText()).toContain('Shown as a reference, not a verdict');
    // The panel with its results and chart passes the same automatic accessibility checks as the pages.
    const axe = await new AxeBuilder({ page }).include('#distribution').analyze();
    expect(axe.violations.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`)).toEqual([]);

    // A proportioning valve fitted with the swap (knee 8 bar, slope 0.3) holds the rear back from about 0.23 g on,
    // and the front locks first again throughout.
    await tick(panel, 'The rear valve');
    const valve = panel.getByRole('group', { name: 'Rear valve after the swap' });
    await valve.getByRole('combobox', { name: 'Rear pressure' }).selectOption('prop');
    await field(valve, 'Knee').fill('8');
    await field(valve, 'Slope above the knee').fill('0.3');
    await expect
      .poll(() => summaryOf(panel).innerText())
      .toContain(
        'The swap moves the balance toward the rear (front share 80.0 % → 64.0 %): the front still locks first up to 1.00 g laden and unladen, the stable order.',
      );
    expect(await summaryOf(panel).getAttribute('data-attention')).toBe('false');
    expect(await cell(panel, 'unladen', 'Rear locks first', 1)).toBe('never up to 1.00 g');
    expect(errors).toEqual([]);
    await context.close();
  });
});
