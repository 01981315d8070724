import { expect } from 'vitest';
import type { APIRequestContext, APIResponse, Browser, BrowserContext, Page } from 'playwright-core';

type Multipart = NonNullable<NonNullable<Parameters<APIRequestContext['fetch']>[1]>['multipart']>;

/**
 * A browser context signed in through the real strategy and the fake provider's page, with an
 * API client (`context.request`, same cookies) that sends the session's CSRF token.
 */
export type SignedIn = {
  context: BrowserContext;
  login: string;
  api: {
    get: (path: string) => Promise<unknown>;
    send: (method: 'POST' | 'PATCH' | 'DELETE', path: string, body?: unknown, multipart?: Multipart) => Promise<unknown>;
  };
};

async function ok(res: APIResponse, what: string): Promise<unknown> {
  const text = await res.text();
  if (!res.ok()) throw new Error(`${what} answered ${res.status()}: ${text}`);
  return text ? JSON.parse(text) : null;
}

export async function signInContext(browser: Browser, baseUrl: string, login: string): Promise<SignedIn> {
  const context = await watchedContext(browser);
  const page = await context.newPage();
  await page.goto(`${baseUrl}/auth/github?returnTo=${encodeURIComponent('/')}`);
  const authorize = new URL(page.url());
  expect(authorize.pathname).toBe('/auth/fake/authorize');
  authorize.searchParams.set('login', login);
  await page.goto(authorize.toString());
  await page.waitForURL((u) => u.pathname === '/');
  await page.close();

  const me = (await ok(await context.request.get(`${baseUrl}/api/me`), 'GET /api/me')) as {
    user: { login: string } | null;
    csrfToken: string;
  };
  expect(me.user?.login).toBe(login);
  const headers = { 'x-csrf-token': me.csrfToken };
  return {
    context,
    login,
    api: {
      get: async (path) => ok(await context.request.get(`${baseUrl}${path}`), `GET ${path}`),
      send: async (method, path, body, multipart) =>
        ok(
          await context.request.fetch(`${baseUrl}${path}`, {
            method,
            headers,
            ...(multipart ? { multipart } : body === undefined ? {} : { data: body }),
          }),
          `${method} ${path}`,
        ),
    },
  };
}

/** Collects, from before the first script runs, what an injected payload would leave behind. */
export const watchScript = () => {
  const w = window as unknown as { __pwned: (n: number) => void; __pwnedList: number[]; __csp: string[] };
  w.__pwnedList = [];
  w.__csp = [];
  w.__pwned = (n: number) => {
    w.__pwnedList = [...w.__pwnedList, n];
  };
  document.addEventListener('securitypolicyviolation', (e) => {
    w.__csp.push(`${e.violatedDirective} blocked ${e.blockedURI || 'inline'} (${e.sourceFile}:${e.lineNumber})`);
  });
};

export type Watched = { page: Page; dialogs: string[]; cspConsole: string[]; errors: string[] };

/** A fresh context whose every page and frame runs `watchScript` first. */
export async function watchedContext(browser: Browser): Promise<BrowserContext> {
  const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  await context.addInitScript(watchScript);
  return context;
}

export async function watchedPage(context: BrowserContext): Promise<Watched> {
  const page = await context.newPage();
  const dialogs: string[] = [];
  const cspConsole: string[] = [];
  const errors: string[] = [];
  page.on('dialog', (d) => {
    dialogs.push(`${d.type()}: ${d.message()}`);
    void d.dismiss();
  });
  page.on('console', (m) => {
    if (/content security policy/i.test(m.text())) cspConsole.push(m.text());
  });
  page.on('pageerror', (e) => errors.push(e.message));
  return { page, dialogs, cspConsole, errors };
}

/** What the main frame's page left in its window: calls of __pwned and CSP violation events. */
export function readWatch(page: Page): Promise<{ pwned: number[]; csp: string[] }> {
  return page.evaluate(() => {
    const w = window as unknown as { __pwnedList?: number[]; __csp?: string[] };
    return { pwned: w.__pwnedList ?? [], csp: w.__csp ?? [] };
  });
}
