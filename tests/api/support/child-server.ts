import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { expect } from 'vitest';

// The real server (`node --import tsx server/index.ts`) as a child process, for tests that need a
// signal, a restart or a second process; and a small cookie-keeping client that signs in like a browser.

const root = path.resolve(import.meta.dirname, '../../..');

export type ChildServer = {
  child: ChildProcess;
  base: string;
  /** resolves with the exit code (or the signal's name) once the process is gone */
  exited: Promise<number | string | null>;
  output: () => string;
};

/** Starts the server on `port` with the database and uploads under `dir`, and waits for /api/health. */
export async function startChildServer(dir: string, port: number, env: Record<string, string> = {}): Promise<ChildServer> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: root,
    env: {
      ...process.env,
      NODE_ENV: 'test',
      HOST: '127.0.0.1',
      PORT: String(port),
      APP_URL: `http://127.0.0.1:${port}`,
      DATABASE_URL: path.join(dir, 'server.db'),
      UPLOAD_DIR: path.join(dir, 'uploads'),
      // the API is all these tests need, and the client may not be built yet
      SERVE_CLIENT: 'none',
      SESSION_SECRET: 'child-server-secret-child-server-secret',
      SEED_DEMO: 'never',
      LOG_LEVEL: 'warn',
      ...env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout!.on('data', (c) => (output += c));
  child.stderr!.on('data', (c) => (output += c));
  const exited = new Promise<number | string | null>((resolve) => child.once('exit', (code, signal) => resolve(code ?? signal)));
  const base = `http://127.0.0.1:${port}`;
  for (let i = 0; i < 300; i++) {
    if (child.exitCode !== null) throw new Error(`the server exited before it was ready:\n${output}`);
    const up = await fetch(`${base}/api/health`).then(
      (r) => r.ok,
      () => false,
    );
    if (up) return { child, base, exited, output: () => output };
    await new Promise((r) => setTimeout(r, 100));
  }
  child.kill('SIGKILL');
  throw new Error(`the server did not start:\n${output}`);
}

export type CookieClient = {
  go: (url: string, init?: RequestInit) => Promise<Response>;
  /** the Cookie header the client sends */
  cookie: () => string;
  csrf: string;
};

/** Signs in through the fake provider like a browser would, keeping the cookies. */
export async function signedInClient(base: string, login: string): Promise<CookieClient> {
  const jar = new Map<string, string>();
  const cookie = () => [...jar].map(([k, v]) => `${k}=${v}`).join('; ');
  const go = async (url: string, init: RequestInit = {}) => {
    const res = await fetch(new URL(url, base), {
      ...init,
      redirect: 'manual',
      headers: { ...(init.headers as object), cookie: cookie() },
    });
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';');
      const i = pair.indexOf('=');
      jar.set(pair.slice(0, i), pair.slice(i + 1));
    }
    return res;
  };
  let res = await go('/auth/github?returnTo=/');
  const authorize = new URL(res.headers.get('location')!, base);
  authorize.searchParams.set('login', login);
  res = await go(authorize.pathname + authorize.search);
  res = await go(res.headers.get('location')!);
  expect(res.status).toBe(302);
  const me = (await (await go('/api/me')).json()) as { user: { login: string } | null; csrfToken: string };
  expect(me.user?.login).toBe(login);
  return { go, cookie, csrf: me.csrfToken };
}

/** A JSON request with the client's CSRF token. */
export const sendJson = (client: CookieClient, method: string, url: string, body?: unknown) =>
  client.go(url, {
    method,
    body: body === undefined ? undefined : JSON.stringify(body),
    headers: { 'content-type': 'application/json', 'x-csrf-token': client.csrf },
  });
