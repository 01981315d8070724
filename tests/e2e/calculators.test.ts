import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Locator, Page } from 'playwright-core';
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

/** The figure shown under a result's label inside a panel. */
const figure = (panel: Locator, label: string) =>
  panel.getByText(label, { exact: true }).locator('xpath=following-sibling::p[1]').innerText();

/** Opens /tools and collects any uncaught page error, which every test checks at its end. */
/** A text input by the start of its label (labels end in the unit shown, e.g. "Spacer (mm)"). */
const field = (scope: Locator, label: string) =>
  scope.getByRole('textbox', { name: new RegExp(`^${label.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}`) });

async function openTools(context: BrowserContext, query = ''): Promise<{ page: Page; errors: string[] }> {
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await page.goto(`${server.url}/tools${query}`);
  await page.getByRole('heading', { level: 1, name: 'Fitment calculators' }).waitFor();
  return { page, errors };
}

describe('calculators page', () => {
  it('when a tyre size and a spacer are entered, then the page shows the reference figures, keeps them in the URL and converts units', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    await context.grantPermissions(['clipboard-read', 'clipboard-write'], { origin: server.url });
    const { page, errors } = await openTools(context);
    const tyre = page.locator('#tyre');
    const offset = page.locator('#offset');

    // A malformed code is refused beside its field, and the results say what to fix instead of failing.
    const tyreInput = field(tyre, 'Tyre size');
    await tyreInput.fill('225/45X17');
    await expect.poll(() => tyre.getByRole('alert').innerText()).toContain('is not a tyre size');
    expect(await tyreInput.getAttribute('aria-invalid')).toBe('true');
    expect(await tyre.locator('[data-waiting]').innerText()).toContain('Fix the marked field');

    // Tyre code convention: 225/45R17 → sidewall 101.25 mm, overall Ø 634.30 mm, circumference 1992.71 mm.
    await tyreInput.fill('225/45R17');
    await expect.poll(() => figure(tyre, 'Sidewall height')).toBe('101.25 mm');
    await expect.poll(() => figure(tyre, 'Overall diameter')).toBe('634.3 mm');
    await expect.poll(() => figure(tyre, 'Circumference')).toBe('1,992.7 mm');
    expect(await tyreInput.getAttribute('aria-invalid')).toBe('false');
    expect(await tyre.getByRole('alert').count()).toBe(0);

    // Common practice, no source: 17×8 ET45 + 15 mm spacer → ET30, backspacing 5.6811 in (144.30 mm), track + 30 mm.
    await field(offset, 'Rim width').fill('8');
    await field(offset, 'Offset ET').fill('45');
    await field(offset, 'Spacer').fill('15');
    await expect.poll(() => figure(offset, 'Effective offset')).toBe('ET30');
    await expect.poll(() => figure(offset, 'Track change per axle')).toBe('+30 mm');
    await expect.poll(() => figure(offset, 'Backspacing')).toBe('144.3 mm');
    await expect.poll(() => figure(offset, 'Each wheel moves outboard')).toBe('15 mm');

    const query = new URL(page.url()).searchParams;
    expect(query.get('tyre')).toBe('225/45R17');
    expect(query.get('spacer')).toBe('15');

    // A panel's link carries that panel's inputs and its anchor, nothing else.
    await offset.getByRole('button', { name: 'Copy link to Offset and spacer' }).click();
    await expect.poll(() => offset.getByRole('status').innerText()).toBe('Link copied');
    const copied = new URL(await page.evaluate(() => navigator.clipboard.readText()));
    expect(copied.pathname).toBe('/tools');
    expect(copied.hash).toBe('#offset');
    expect(Object.fromEntries(copied.searchParams)).toEqual({ width: '8', et: '45', spacer: '15' });

    // Reloading the address restores every input and result.
    await page.reload();
    await page.getByRole('heading', { level: 1, name: 'Fitment calculators' }).waitFor();
    expect(await field(tyre, 'Tyre size').inputValue()).toBe('225/45R17');
    expect(await field(offset, 'Spacer').inputValue()).toBe('15');
    await expect.poll(() => figure(tyre, 'Sidewall height')).toBe('101.25 mm');
    await expect.poll(() => figure(offset, 'Effective offset')).toBe('ET30');

    // Imperial: inputs and outputs in inches, the URL still in millimetres. 101.25 / 25.4 = 3.98622 in; 30 / 25.4 = 1.18110 in;
    // shown to the trade's precision: thousandths for figures given to 0.01 mm, hundredths for those given to 0.1 mm.
    await page.getByRole('group', { name: 'Units for the calculators' }).getByRole('button', { name: 'Imperial' }).click();
    await expect.poll(() => figure(tyre, 'Sidewall height')).toBe('3.986 in');
    await expect.poll(() => figure(tyre, 'Overall diameter')).toBe('24.97 in');
    await expect.poll(() => figure(offset, 'Track change per axle')).toBe('+1.18 in');
    expect(await offset.getByText('Spacer (in)').count()).toBe(1);
    expect(await field(offset, 'Spacer').inputValue()).toBe('0.5906');
    await expect.poll(() => figure(offset, 'Effective offset')).toBe('ET30');

    // A spacer typed in inches is stored in mm: 0.75 in = 19.05 mm → ET25.95.
    await field(offset, 'Spacer').fill('0.75');
    await expect.poll(() => new URL(page.url()).searchParams.get('spacer')).toBe('19.05');
    await expect.poll(() => figure(offset, 'Effective offset')).toBe('ET25.95');
    expect(errors).toEqual([]);
    await context.close();
  });

  it('when the brake chain from the references is entered, then the front share moves 65.93 % → 73.72 % and the shift is flagged', async () => {
    const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
    const { page, errors } = await openTools(context);
    const brakes = page.locator('#brakes');
    const corner = async (name: string, pistons: string, rotor: string, pad: string) => {
      const group = brakes.getByRole('group', { name });
      await field(group, 'Pistons per side').fill(pistons);
      await field(group, 'Rotor Ø').fill(rotor);
      await field(group, 'Pad height').fill(pad);
    };
    // Disc-brake textbook formula: 50 bar, μ 0.40; stock 1 × 54 mm, 280/50; rear 1 × 38 mm, 280/40; swap 40 + 44 mm, 330/55.
    await corner('Stock front', '54', '280', '50');
    expect(await brakes.locator('[data-waiting]').innerText()).toContain('stock rear pistons');
    await corner('Stock rear', '38', '280', '40');
    await corner('Swapped front', '40, 44', '330', '55');
    await expect.poll(() => figure(brakes, 'Front share, stock')).toBe('65.93 %');
    await expect.poll(() => figure(brakes, 'Front share, swapped')).toBe('73.72 %');
    // the same words as the swap sheet and the review desk: the direction, and what it risks
    const note = brakes.locator('[data-balance]');
    expect(await note.getAttribute('data-balance')).toBe('forward');
    expect(await note.getAttribute('data-severity')).toBe('advisory');
    expect(await note.innerText()).toContain('Balance moves toward the front: front share 65.9 % → 73.7 % (+7.8 points).');
    expect(await note.innerText()).toContain('fronts still lock first');
    // Textbook torque per corner: 1053.50 / 1527.44 / 544.38 N·m, shown whole.
    const table = await brakes.getByRole('table').innerText();
    expect(table).toContain('1,054 N·m');
    expect(table).toContain('1,527 N·m');
    expect(table).toContain('544 N·m');

    // A pad taller than the rotor radius is refused at that field.
    await field(brakes.getByRole('group', { name: 'Swapped front' }), 'Pad height').fill('170');
    await expect
      .poll(() => brakes.getByRole('group', { name: 'Swapped front' }).getByRole('alert').innerText())
      .toContain('less than the rotor radius');
    expect(await brakes.locator('[data-balance]').count()).toBe(0);
    expect(await brakes.getByRole('note', { name: 'Safety caution' }).count()).toBe(1);
    expect(errors).toEqual([]);
    await context.close();
  });

  it('when a bolt is too short for its spacer, then thread engagement fails with its margin and the rule applied', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    // Common practice, no source: M12×1.5 in steel needs 1.0 × d = 12 mm = 8 turns.
    const { page, errors } = await openTools(context, '?thread=M12x1.5&bolt=28&from=seat_end&clamp=14&tspacer=5#thread');
    const thread = page.locator('#thread');
    const topOf = (id: string) => page.evaluate((el) => document.getElementById(el)!.getBoundingClientRect().top, id);
    // The link's anchor lands on its panel, and the jump list moves between panels.
    await expect.poll(() => topOf('thread')).toBeLessThan(120);
    expect(await topOf('thread')).toBeGreaterThanOrEqual(-1);
    await page.getByRole('navigation', { name: 'Calculators' }).getByRole('link', { name: 'Brake balance' }).click();
    await expect.poll(() => topOf('brakes')).toBeLessThan(120);
    expect(await topOf('brakes')).toBeGreaterThanOrEqual(-1);
    expect(new URL(page.url()).searchParams.get('bolt')).toBe('28');
    const verdict = thread.locator('[data-check="engagement"] [data-verdict]');
    await expect.poll(() => verdict.getAttribute('data-verdict')).toBe('fail');
    // the default seats (60° cone bolt, wheel seat the same) match
    expect(await thread.locator('[data-check="seat"] [data-verdict]').getAttribute('data-verdict')).toBe('pass');
    const text = await verdict.innerText();
    expect(text).toContain('9 mm · 6 turns');
    expect(text).toContain('Margin: −3 mm');
    expect(text).toContain('1.0 × bolt diameter in a steel hub');
    await expect.poll(() => figure(thread, 'Bolt needed with the spacer')).toBe('33 mm');
    await expect.poll(() => figure(thread, 'Shortest bolt for the rule')).toBe('31 mm');

    await field(thread, 'Bolt length').fill('35');
    await expect.poll(() => verdict.getAttribute('data-verdict')).toBe('pass');
    expect(await verdict.innerText()).toContain('Margin: +4 mm');

    await field(thread, 'Thread').fill('M12');
    await expect.poll(() => thread.getByRole('alert').innerText()).toContain('is not a thread like M12x1.5');
    expect(errors).toEqual([]);
    await context.close();
  });
  it('when a unified stud and nut meet a ball-seat wheel, then the seat fails with a caution, and a blind hole shows a bolt bottoming out', async () => {
    const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
    // ASME B1.1: 7/16-20 UNF, d = 0.4375 in = 11.1125 mm; common practice, no source: 1.0 × d in a steel nut.
    // Stud 38 mm − wheel 12 mm = 26 mm past the seat; the open nut's 14 mm of thread limits it: margin 14 − 11.1125 = 2.89 mm.
    const { page, errors } = await openTools(
      context,
      '?thread=7%2F16-20&fast=stud_nut&stud=38&nut=14&clamp=12&wseat=ball&wball=13#thread',
    );
    const thread = page.locator('#thread');
    const check = (id: string) => thread.locator(`[data-check="${id}"] [data-verdict]`);
    await expect.poll(() => check('seat').getAttribute('data-verdict')).toBe('fail');
    expect(await check('seat').innerText()).toContain('60° cone fastener in a ball R13 wheel seat');
    expect(await thread.getByRole('note', { name: 'Safety caution' }).innerText()).toContain('the wheel can come off');
    expect(await check('engagement').getAttribute('data-verdict')).toBe('pass');
    expect(await check('engagement').innerText()).toContain('Margin: +2.89 mm');
    expect(await figure(thread, 'Thread 7/16-20 UNF')).toBe('11.11 mm');

    // The nut gets the wheel's ball seat: the seats match and the caution about seats goes.
    await thread.getByRole('combobox', { name: 'Seat', exact: true }).selectOption('ball');
    await field(thread, 'Ball radius').fill('13');
    await expect.poll(() => check('seat').getAttribute('data-verdict')).toBe('pass');
    expect(await thread.getByRole('note', { name: 'Safety caution' }).innerText()).not.toContain('the wheel can come off');

    // A ball-seat bolt measured under the head: 45 − 7 (ball seat) − 12 = 26 mm into a 20 mm blind hole → bottoms out.
    await thread.getByRole('combobox', { name: 'Fastener', exact: true }).selectOption('bolt');
    await field(thread, 'Bolt length').fill('45');
    await field(thread, 'Ball seat height').fill('7');
    await field(thread, 'Hub thread depth').fill('20');
    await expect.poll(() => check('bottoming').getAttribute('data-verdict')).toBe('fail');
    expect(await check('bottoming').innerText()).toContain('Margin: −6 mm');
    expect(await check('engagement').getAttribute('data-verdict')).toBe('fail');
    expect(await figure(thread, 'Longest bolt before it bottoms')).toBe('39 mm');
    expect(await thread.getByRole('note', { name: 'Safety caution' }).innerText()).toContain('clamps nothing');
    expect(errors).toEqual([]);
    await context.close();
  });

  it('when a drum corner is entered, then its torque follows the drum form with its brake factor source, in either unit system', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    // Limpert, Brake Design and Safety: T = p × A_wc × C* × r_drum; 20.64 mm, 203.2 mm, C* 2.2, 40 bar → 299.15 N·m
    const { page, errors } = await openTools(context, '?wcyl=20.64&drum=203.2&cstar=2.2&dbar=40#drum');
    const drum = page.locator('#drum');
    await expect.poll(() => figure(drum, 'Brake torque per wheel')).toBe('299 N·m');
    expect(await drum.locator('[data-brake-factor-source]').innerText()).toContain('your value');
    // Clearing C* falls back to the typical leading/trailing value and names where it comes from.
    await field(drum, 'Brake factor C*').fill('');
    await expect.poll(() => figure(drum, 'Brake torque per wheel')).toBe('272 N·m');
    expect(await drum.locator('[data-brake-factor-source]').innerText()).toContain('from memory');
    // NIST SP 811: 271.95 N·m / 1.3558179 = 200.6 lbf·ft; 40 bar = 580.2 psi
    await page.getByRole('group', { name: 'Units for the calculators' }).getByRole('button', { name: 'Imperial' }).click();
    await expect.poll(() => figure(drum, 'Brake torque per wheel')).toBe('201 lbf·ft');
    expect(await field(drum, 'Line pressure').inputValue()).toBe('580.2');
    expect(errors).toEqual([]);
    await context.close();
  });

  it('when a caliper is lifted past the rotor edge, then pad overhang fails, centring gets its shim and a minus sign types on a phone', async () => {
    const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
    // Plane geometry: 330/2 − 2 + 4 − 330/2 = +2 mm overhang; ring centre 50 − 14 = 36, caliper 60 − 25.5 = 34.5 → move 1.5 mm inboard.
    const { page, errors } = await openTools(
      context,
      '?cfdes=330&cfstep=2&cfpad=50&cftmin=26&cftmax=30&cfcent=25.5&cflift=4&cfmount=60&cfrotor=330&cfthick=28&cfhat=50&cfring=210&cfshims=0,5%3B%201&cfmoves=inboard&cfportt=M10x1&cflcet=3%2F8-24%20UNF#caliper-fit',
    );
    const fit = page.locator('#caliper-fit');
    const check = (id: string) => fit.locator(`[data-check="${id}"] [data-verdict]`);
    await expect.poll(() => check('pad-overhang').getAttribute('data-verdict')).toBe('fail');
    expect(await check('pad-overhang').innerText()).toContain('2 mm past the edge');
    expect(await fit.locator('[data-caliper-drawing] svg').getAttribute('aria-label')).toContain(
      'reaches 2 mm past the rotor edge',
    );
    // shim sizes typed with decimal commas and a semicolon: 0,5; 1 → the solver's 1 + 0.5 mm stack
    expect(await check('axial-centring').getAttribute('data-verdict')).toBe('pass');
    expect(await figure(fit, 'Centring shim')).toBe('1 mm + 0.5 mm');
    expect(await fit.locator('[data-check="axial-centring"]').innerText()).toContain('common practice, no source');
    // ISO 724 / ASME B1.1: M10×1 is not 3/8-24 UNF
    expect(await check('line-caliper-end').getAttribute('data-verdict')).toBe('fail');
    expect(await fit.getByRole('note', { name: 'Safety caution' }).innerText()).toContain('never force or mix fittings');

    // The radial lift is signed: typed with a minus on a phone keyboard (text input mode), it brings the pad back on.
    const lift = field(fit, 'Radial lift');
    expect(await lift.getAttribute('inputmode')).toBe('text');
    await lift.fill('');
    await lift.pressSequentially('-3');
    await expect.poll(() => new URL(page.url()).searchParams.get('cflift')).toBe('-3');
    await expect.poll(() => check('pad-overhang').getAttribute('data-verdict')).toBe('pass');
    expect(await check('pad-overhang').innerText()).toContain('5 mm inside the edge');
    expect(errors).toEqual([]);
    await context.close();
  });

  it('when light-truck, van and older tyre codes are entered, then their load and speed are read and an axle load is checked', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const { page, errors } = await openTools(context, '#tyre');
    const tyre = page.locator('#tyre');
    const tyreInput = field(tyre, 'Tyre size');
    // ISO 4000-1 / ETRTO load index table: 123 → 1550 kg, 120 → 1400 kg; speed symbol Q → 160 km/h
    await tyreInput.fill('LT265/75R16 123/120Q');
    await expect.poll(() => figure(tyre, 'Load index 123/120')).toBe('1,550 kg / 1,400 kg');
    expect(await figure(tyre, 'Speed Q')).toBe('160 km/h');
    // Tire code reference article: no aspect ratio → 82 %; 165 × 0.82 = 135.3 mm
    await tyreInput.fill('165SR15');
    await expect.poll(() => figure(tyre, 'Sidewall height')).toBe('135.3 mm');
    expect(await tyre.innerText()).toContain('82 % assumed');
    // Flotation: 31 in overall = 787.4 mm
    await tyreInput.fill('31x10.50R15 LT 109Q');
    await expect.poll(() => figure(tyre, 'Overall diameter')).toBe('787.4 mm');
    // X is not in the speed symbol table
    await tyreInput.fill('225/45R17 94X');
    await expect.poll(() => tyre.getByRole('alert').innerText()).toContain('"X" is not a speed symbol');
    // 104 → 900 kg per tyre: two carry 1800 kg, so 1850 kg is 50 kg too much
    await tyreInput.fill('195/70R15C 104/102R');
    await field(tyre, 'Axle load').fill('1850');
    const load = tyre.locator('[data-verdict]', { hasText: 'Axle load on' });
    await expect.poll(() => load.getAttribute('data-verdict')).toBe('fail');
    expect(await load.innerText()).toContain('Margin: −50 kg');
    // twin tyres use the second index: 4 × 850 kg = 3400 kg
    await tyre.getByRole('combobox', { name: 'Tyres on the axle' }).selectOption('4');
    await expect.poll(() => load.getAttribute('data-verdict')).toBe('pass');
    expect(await load.innerText()).toContain('Margin: +1,550 kg');
    expect(errors).toEqual([]);
    await context.close();
  });
});
