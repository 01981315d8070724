import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { launchBrowser } from './support/browser';
import { startServer, type RunningServer } from './support/server';
import { xssPayloads } from './support/xss-payloads';
import { readWatch, signInContext, watchedContext, watchedPage, type SignedIn } from './support/watched-page';

// Every user-written field gets hostile strings through the real API from signed-in browser
// contexts; then the pages that render them are opened in Chromium. Nothing may run (no dialog,
// no window.__pwned call), nothing may be blocked by the CSP (which would mean markup got through
// and only the policy stopped it), no live markup from a payload may be in the DOM, and what the
// server kept must show as text.

let server: RunningServer;
let browser: Browser;
beforeAll(async () => {
  server = await startServer({ SEED_DEMO: 'auto' });
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

// ---------- which payload went through which field ----------

const usedIn = new Map<string, Set<number>>();
const cursors = new Map<string, number>();
/**
 * the next `n` payloads that `fits` allows, recorded against `field`; each field walks the corpus
 * on its own, from its own starting point, so repeated uses of a field get different payloads
 */
function pick(field: string, n: number, fits: (p: string) => boolean = () => true): string[] {
  if (!cursors.has(field)) cursors.set(field, (cursors.size * 7) % xssPayloads.length);
  const out: string[] = [];
  for (let tries = 0; out.length < n && tries < xssPayloads.length * 2; tries++) {
    const cursor = cursors.get(field)!;
    cursors.set(field, cursor + 1);
    const i = cursor % xssPayloads.length;
    if (!fits(xssPayloads[i]!)) continue;
    out.push(xssPayloads[i]!);
    if (!usedIn.has(field)) usedIn.set(field, new Set());
    usedIn.get(field)!.add(i);
  }
  expect(out.length, `payloads for ${field}`).toBe(n);
  return out;
}
const one = (field: string, fits?: (p: string) => boolean) => pick(field, 1, fits)[0]!;
const joined = (field: string, n: number, sep = '\n') => pick(field, n).join(sep);
/** a part number is at most 40 characters as sent (longer is refused with a field reason); one letter goes before the payload */
const short = (p: string) => p.length <= 39;
/** a profile name is at most 80 characters and has no control characters */
const nameFit = (p: string) => p.length <= 72 && !/\n|\t/.test(p);

// ---------- what the pages must show ----------

type SwapView = {
  id: number;
  swapSlug: string;
  number: number;
  status: string;
  reviewNote: string | null;
  data: {
    title: string;
    summary: string;
    parts: { name: string; partNumbers: string[]; notes: string }[];
    adapter: { name: string; partNumber: string; notes: string } | null;
    fasteners: { label: string }[];
    torque: { notes: string }[];
    wheel: { notes: string; testedWheels: { note: string }[] } | null;
    rotors: { partNumber: string; notes: string }[];
  };
  photos: { id: string; caption: string }[];
};

/** the free text of a revision that the sheet renders as plain text */
function sheetTexts(v: SwapView): string[] {
  const d = v.data;
  return [
    d.title,
    d.summary,
    ...d.parts.flatMap((p) => [p.name, ...p.partNumbers, p.notes]),
    ...(d.adapter ? [d.adapter.name, d.adapter.partNumber, d.adapter.notes] : []),
    ...d.fasteners.map((f) => f.label),
    ...d.torque.map((t) => t.notes),
    ...(d.wheel ? [d.wheel.notes, ...d.wheel.testedWheels.map((w) => w.note)] : []),
    ...d.rotors.flatMap((r) => [r.partNumber, r.notes]),
    ...v.photos.map((p) => p.caption),
  ].filter((t) => t.trim() !== '');
}

const squash = (s: string) => s.replace(/\s+/g, ' ').trim();

async function png(shade: number): Promise<Buffer> {
  return sharp({ create: { width: 64, height: 48, channels: 3, background: { r: shade, g: 120, b: 90 } } })
    .png()
    .toBuffer();
}

function swapInput(tag: string, chassisId: number, literalTitle?: string) {
  const title = literalTitle ?? `${tag} swap ${one('title')}`;
  return {
    chassisId,
    axle: 'front' as const,
    category: 'brakes' as const,
    body: `## ${tag} write-up\n\n${joined('write-up markdown', 12, '\n\n')}\n\nThe end of the ${tag} write-up.`,
    data: {
      schemaVersion: 2,
      title,
      summary: `${tag}: ${joined('summary', 3, ' | ')}`,
      parts: [0, 1, 2, 3].map((k) => ({
        role: `caliper ${k}`,
        kind: 'caliper',
        name: `${tag} part ${k} ${one('part name')}`,
        maker: '',
        partNumbers: [`P${one('part number', short)}`, `Q${one('part number', short)}`],
        quantity: 2,
        notes: `${tag} notes ${k}: ${joined('part notes', 2, ' ')}`,
      })),
      adapter: {
        name: `${tag} bracket ${one('adapter name')}`,
        maker: '',
        partNumber: `B${one('adapter part number', short)}`,
        hardwareIncluded: [],
        notes: `${tag} adapter: ${joined('adapter notes', 2, ' ')}`,
      },
      rotors: [
        {
          axle: 'front',
          diameterMm: 300,
          thicknessMm: 24,
          vented: true,
          partNumber: `R${one('rotor part number', short)}`,
          notes: `${tag} rotor ${one('rotor notes')}`,
        },
      ],
      fasteners: [0, 1, 2].map((k) => ({
        id: `f${k}`,
        kind: 'other',
        label: `${tag} fastener ${k} ${one('torque fastener')}`,
      })),
      torque: [0, 1, 2].map((k) => ({
        fastenerId: `f${k}`,
        nm: 80 + k,
        notes: `${tag} torque ${one('torque notes')}`,
      })),
      wheel: {
        minDiameterIn: 16,
        caliperRadialProjectionMm: 12,
        caliperOutboardMm: 30,
        testedWheels: [
          {
            diameterIn: 16,
            widthIn: 7,
            offsetMm: 35,
            spacerMm: 0,
            outcome: 'fits',
            note: `${tag} wheel ${one('tested wheel note')}`,
          },
        ],
        notes: `${tag} wheel notes ${one('wheel notes')}`,
      },
    },
  };
}

/** Live markup a payload could have left in this document: handlers, script URLs, unexpected elements. */
function injectedMarkup(): string[] {
  const found: string[] = [];
  const urlAttrs = ['href', 'src', 'action', 'formaction', 'data', 'xlink:href', 'poster', 'background', 'content'];
  for (const el of Array.from(document.querySelectorAll('*'))) {
    const tag = el.tagName.toLowerCase();
    for (const a of Array.from(el.attributes)) {
      const name = a.name.toLowerCase();
      // eslint-disable-next-line no-control-regex -- browsers drop these inside a URL scheme
      const value = a.value.toLowerCase().replace(/[\s\u0000-\u001f]+/g, '');
      if (name.startsWith('on')) found.push(`<${tag} ${name}>`);
      if (urlAttrs.includes(name) && /^(javascript|vbscript):|^data:text\/html/.test(value))
        found.push(`<${tag} ${name}="${a.value}">`);
      if (name === 'style' && /javascript:|expression\(/.test(value)) found.push(`<${tag} style="${a.value}">`);
    }
    // the page's own data blocks (the server's query cache, structured data) never run; one that a payload broke
    // out of no longer parses as JSON
    const dataBlock = ['application/json', 'application/ld+json'].includes((el as HTMLScriptElement).type);
    let parses = false;
    try {
      JSON.parse(el.textContent ?? '');
      parses = true;
    } catch {
      // not data: judged below like any other script
    }
    if (tag === 'script' && !(dataBlock && parses) && !(el as HTMLScriptElement).src.startsWith(`${location.origin}/assets/`))
      found.push(`<script> ${el.textContent?.slice(0, 60)}`);
    if (['object', 'embed', 'base', 'marquee', 'math', 'mglyph', 'template', 'noscript'].includes(tag)) found.push(`<${tag}>`);
    if (tag === 'meta' && el.hasAttribute('http-equiv')) found.push('<meta http-equiv>');
    if (tag === 'iframe' && !el.hasAttribute('sandbox')) found.push('<iframe> without sandbox');
    if (tag === 'svg' && el.querySelector('script')) found.push('<svg><script>');
  }
  return found;
}

// ---------- the pages ----------

type PageCheck = { name: string; url: string; texts: string[] };
const checked: string[] = [];

async function checkPage(context: BrowserContext, check: PageCheck, extra?: (page: Page) => Promise<void>) {
  for (const t of check.texts) expect(typeof t, `${check.name}: expected text`).toBe('string');
  const { page, dialogs, cspConsole, errors } = await watchedPage(context);
  await page.goto(`${server.url}${check.url}`);
  await page.waitForLoadState('networkidle');
  const body = page.locator('body');
  // the page has rendered what it is about before anything is judged
  if (check.texts.length)
    await expect
      .poll(async () => squash((await body.textContent()) ?? ''), { timeout: 15_000 })
      .toContain(squash(check.texts[0]!));
  else await page.locator('main h1').first().waitFor();
  if (extra) await extra(page);
  await page.waitForTimeout(300);

  const assertClean = async (label: string) => {
    const text = squash((await body.textContent()) ?? '');
    for (const t of check.texts) expect(text, `${label}: text kept as data`).toContain(squash(t));
    const frames: string[] = [];
    for (const frame of page.frames()) {
      try {
        frames.push(
          ...(await frame.evaluate(injectedMarkup)).map((m) => `${frame === page.mainFrame() ? 'page' : 'frame'}: ${m}`),
        );
      } catch (err) {
        frames.push(`could not inspect a frame: ${(err as Error).message}`);
      }
    }
    expect(frames, `${label}: injected markup`).toEqual([]);
    const watch = await readWatch(page);
    expect(watch.pwned, `${label}: payloads that ran`).toEqual([]);
    expect(watch.csp, `${label}: CSP violations`).toEqual([]);
    expect(cspConsole, `${label}: CSP console messages`).toEqual([]);
    expect(dialogs, `${label}: dialogs`).toEqual([]);
    expect(errors, `${label}: page errors`).toEqual([]);
    checked.push(label);
  };
  await assertClean(check.name);
  return { page, assertClean };
}

// ---------- the journey ----------

describe('hostile input in a real browser', () => {
  const people: Record<string, SignedIn> = {};
  let a: SwapView; // sent back, edited, approved: public
  let b: SwapView; // in review
  let c: SwapView; // sent back, left there
  const names: Record<string, string> = {};
  const fitted: string[] = [];
  const flags: string[] = [];
  const cars: string[] = [];
  const decisionNotes: string[] = [];
  let linkCode = '';
  // a look-alike of a script tag is no tag at all: the title must come back exactly as typed
  const literalTitle = `Vela calipers ${xssPayloads[29]}`;

  it('when payloads are written into every field through the API, then each write is accepted and kept as data', async () => {
    for (const login of ['rivet_rosa', 'camber_kai', 'pistonpaul', 'gauge_mo', 'ridgeway_shop']) {
      people[login] = await signInContext(browser, server.url, login);
    }
    const {
      rivet_rosa: rosa,
      camber_kai: kai,
      pistonpaul: paul,
      gauge_mo: mo,
      ridgeway_shop: shop,
    } = people as Record<string, SignedIn>;

    // profile names, shown as authors, reporters and fitted-report members
    for (const who of [rosa, kai, paul]) {
      const typed = `${who.login.split('_')[0]} ${one('profile name', nameFit)}`;
      const res = (await who.api.send('PATCH', '/api/me', { name: typed })) as { user: { name: string } };
      expect(res.user.name, 'a profile name is kept exactly as typed').toBe(typed);
      names[who.login] = res.user.name;
    }

    const chassis = (await rosa.api.get('/api/chassis')) as { items: { id: number; slug: string }[] };
    const h31 = chassis.items.find((x) => x.slug === 'halden-h31')!;
    expect(h31).toBeDefined();

    const create = async (who: SignedIn, input: ReturnType<typeof swapInput>) =>
      (await who.api.send('POST', '/api/submissions', input)) as SwapView;
    const withPhotos = async (who: SignedIn, view: SwapView) => {
      for (const shade of [40, 200]) {
        await who.api.send('POST', `/api/submissions/${view.id}/photos`, undefined, {
          photos: { name: `fitted-${shade}.png`, mimeType: 'image/png', buffer: await png(shade) },
        });
      }
      const current = (await who.api.get(`/api/submissions/${view.id}`)) as SwapView;
      expect(current.photos).toHaveLength(2);
      const res = (await who.api.send('PATCH', `/api/submissions/${view.id}/photos`, {
        photos: current.photos.map((p) => ({ id: p.id, caption: `Caption ${one('photo caption')}` })),
      })) as { photos: SwapView['photos'] };
      return { ...view, photos: res.photos };
    };

    // swap A: sent back with a payload reason, edited, resubmitted, approved with a payload note
    const alpha = swapInput('Alpha', h31.id, literalTitle);
    usedIn.set('title', new Set([...(usedIn.get('title') ?? []), 29]));
    a = await withPhotos(rosa, await create(rosa, alpha));
    expect(a.data.title, 'a title without tags is kept literally').toBe(literalTitle);
    await rosa.api.send('POST', `/api/submissions/${a.id}/submit`);
    const sendBack = `Please fix: ${joined('review note', 3)}`;
    const sentBack = (await mo.api.send('POST', `/api/review/${a.id}/send-back`, { note: sendBack })) as { revision: SwapView };
    expect(sentBack.revision.status).toBe('sent_back');
    decisionNotes.push(sentBack.revision.reviewNote!);
    // the edit adds to the summary and keeps the rest, so everything written above is what gets published
    const edited = { ...alpha, data: { ...alpha.data, summary: `${alpha.data.summary} | edited: ${one('summary')}` } };
    a = (await rosa.api.send('PATCH', `/api/submissions/${a.id}`, edited)) as SwapView;
    await rosa.api.send('POST', `/api/submissions/${a.id}/submit`);
    const approveNote = `Approved: ${joined('review note', 3)}`;
    const approved = (await mo.api.send('POST', `/api/review/${a.id}/approve`, { note: approveNote })) as { revision: SwapView };
    expect(approved.revision.status).toBe('approved');
    decisionNotes.push(approved.revision.reviewNote!);
    a = approved.revision;

    // swap B stays in review; swap C is sent back and left there
    b = await withPhotos(kai, await create(kai, swapInput('Bravo', h31.id)));
    await kai.api.send('POST', `/api/submissions/${b.id}/submit`);
    c = await create(rosa, swapInput('Charlie', h31.id));
    await rosa.api.send('POST', `/api/submissions/${c.id}/submit`);
    c = (
      (await mo.api.send('POST', `/api/review/${c.id}/send-back`, { note: `Missing: ${joined('review note', 2)}` })) as {
        revision: SwapView;
      }
    ).revision;
    decisionNotes.push(c.reviewNote!);

    // fitted reports and flags on the public swap
    for (const who of [kai, paul]) {
      const view = (await who.api.send('POST', `/api/swaps/${a.swapSlug}/fitted-reports`, {
        diameterIn: 16,
        widthIn: 7,
        offsetMm: 35,
        spacerMm: 0,
        note: `Fitted: ${joined('fitted-report note', 3)}`,
      })) as { mine: { note: string } };
      fitted.push(view.mine.note);
      const flag = (await who.api.send('POST', `/api/swaps/${a.swapSlug}/flags`, {
        kind: 'other',
        reason: `Wrong: ${joined('flag reason', 3)}`,
      })) as { reason: string };
      flags.push(flag.reason);
    }

    // the shop's link note and about text
    const link = (await shop.api.send('POST', '/api/shop-links', {
      swapSlug: a.swapSlug,
      note: `Our quote: ${joined('shop-link note', 4, '\n\n')}`,
    })) as { link: { code: string } };
    linkCode = link.link.code;
    await shop.api.send('PATCH', '/api/shops/ridgeway-performance', {
      about: `We fit brakes.\n\n${joined('shop about', 4, '\n\n')}`,
    });

    // car nicknames
    for (let k = 0; k < 3; k++) {
      const car = (await rosa.api.send('POST', '/api/cars', {
        chassisId: h31.id,
        nickname: `Car ${k} ${one('car nickname', (p) => p.length <= 50)}`,
        wheelDiameterIn: 16,
        wheelWidthIn: 7,
        wheelOffsetMm: 38,
        tyre: '205/55R16',
        spacerMm: 0,
      })) as { car: { nickname: string } };
      cars.push(car.car.nickname);
    }

    const missing = xssPayloads.map((_, i) => i).filter((i) => ![...usedIn.values()].some((s) => s.has(i)));
    expect(missing, 'payloads that went through no field').toEqual([]);
    for (const [field, set] of usedIn) expect(set.size, `payloads through ${field}`).toBeGreaterThanOrEqual(2);
    const pairs = [...usedIn.values()].reduce((n, s) => n + s.size, 0);
    console.log(
      `hostile input: ${xssPayloads.length} payloads through ${usedIn.size} fields, ${pairs} payload-field pairs written`,
    );
    console.log(`hostile input: per field ${[...usedIn].map(([f, set]) => `${f} ${set.size}`).join(', ')}`);
  });

  it('when the public swap sheet is opened and printed, then nothing from the payloads runs and the text is there', async () => {
    const context = await watchedContext(browser);
    const texts = [...sheetTexts(a), names.rivet_rosa!, ...fitted, names.camber_kai!, names.pistonpaul!];
    const { page, assertClean } = await checkPage(context, { name: 'swap sheet', url: `/swaps/${a.swapSlug}`, texts });
    expect(squash((await page.locator('main h1').first().textContent()) ?? '')).toBe(squash(literalTitle));
    // every photo opens in the viewer with its caption
    await page.getByRole('button', { name: /^Open photo 1/ }).click();
    await page.getByRole('dialog').waitFor();
    await page.keyboard.press('Escape');
    await assertClean('swap sheet, photo viewer opened');
    await page.emulateMedia({ media: 'print' });
    await page.pdf({ format: 'A4' });
    await assertClean('printed swap sheet');
    await context.close();
  });

  it('when the moderator opens the review desk and review pages, then nothing runs', async () => {
    const { context } = people.gauge_mo!;
    const desk = await checkPage(context, {
      name: 'review desk',
      url: '/review',
      texts: [b.data.title, names.camber_kai!, ...flags, names.pistonpaul!],
    });
    await desk.page.close();
    const review = await checkPage(context, { name: 'review page (in review)', url: `/review/${b.id}`, texts: sheetTexts(b) });
    await review.page.close();
    const history = await checkPage(context, {
      name: 'review page (approved, with history)',
      url: `/review/${a.id}`,
      texts: [a.data.title, ...decisionNotes.slice(0, 2)],
    });
    await history.page.close();
  });

  it('when the shop page and a pinned sheet are opened, then nothing runs', async () => {
    const context = await watchedContext(browser);
    const shopPage = await checkPage(context, {
      name: 'shop page',
      url: '/shops/ridgeway-performance',
      texts: ['We fit brakes.', a.data.title],
    });
    await shopPage.page.close();
    const pinned = await checkPage(context, {
      name: 'pinned sheet via /l/',
      url: `/l/${linkCode}`,
      texts: sheetTexts(a),
    });
    expect(new URL(pinned.page.url()).pathname).toBe(`/swaps/${a.swapSlug}/r/${a.number}`);
    await pinned.page.close();
    // the link's note is private to the shop, so it renders only for the shop's own account
    const own = await checkPage(people.ridgeway_shop!.context, {
      name: 'pinned sheet via /l/ as the shop',
      url: `/l/${linkCode}`,
      texts: ['Our quote:', ...sheetTexts(a)],
    });
    await own.page.close();
    const found = await checkPage(context, {
      name: 'search results',
      url: `/search?q=${encodeURIComponent('Vela calipers')}`,
      texts: [a.data.title],
    });
    await found.page.close();
    await context.close();
  });

  it('when the outbox is read with every HTML version open, then nothing runs', async () => {
    const { context } = people.gauge_mo!;
    // the messages quote a note line by line
    const noteLines = decisionNotes.flatMap((n) => n.split('\n')).filter((l) => l.trim() !== '');
    const { page, assertClean } = await checkPage(context, {
      name: 'outbox',
      url: '/outbox',
      texts: [a.data.title, c.data.title, ...noteLines],
    });
    const summaries = page.locator('details > summary');
    const count = await summaries.count();
    expect(count).toBeGreaterThan(0);
    for (let i = 0; i < count; i++) await summaries.nth(i).click();
    await expect.poll(() => page.frames().length).toBe(count + 1);
    await assertClean('outbox, HTML versions open');
    await page.close();
  });

  it('when the member opens my cars, my submissions and the sent-back form, then nothing runs', async () => {
    const { context } = people.rivet_rosa!;
    const myCars = await checkPage(context, { name: 'my cars', url: '/me/cars', texts: cars });
    await myCars.page.close();
    const mine = await checkPage(context, {
      name: 'my submissions',
      url: '/me/submissions',
      texts: [a.data.title, c.data.title, c.reviewNote!],
    });
    await mine.page.close();
    const form = await checkPage(context, {
      name: 'sent-back submission form',
      url: `/submissions/${c.id}/edit`,
      texts: [c.reviewNote!],
    });
    await form.page.close();
    console.log(`hostile input: ${checked.length} page states checked: ${checked.join('; ')}`);
    for (const who of Object.values(people)) await who.context.close();
  });
});
