import { spawn } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';

const root = path.resolve(import.meta.dirname, '../../..');

export type RunningServer = {
  url: string;
  /** the server process's id, for benchmarks that read its CPU time */
  pid: number;
  /** temp folder holding the database and uploads */
  dir: string;
  /** everything the server printed so far, for failure messages */
  output: () => string;
  stop: () => Promise<void>;
};

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = net.createServer();
    probe.unref();
    probe.on('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as net.AddressInfo;
      probe.close(() => resolve(port));
    });
  });
}

/**
 * Starts the real server (`node --import tsx server/index.ts`) serving the built client from dist/,
 * on a free port with its own temp database and upload folder. Run `npm run build` first.
 */
export async function startServer(env: Record<string, string> = {}): Promise<RunningServer> {
  if (!fs.existsSync(path.join(root, 'dist', 'index.html'))) {
    throw new Error('No built client in dist/: run `npm run build` before the browser tests.');
  }
  const port = await freePort();
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'swapyard-e2e-'));
  const url = `http://127.0.0.1:${port}`;
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: root,
    env: {
      ...process.env,
      NODE_ENV: 'test',
      HOST: '127.0.0.1',
      PORT: String(port),
      APP_URL: url,
      DATABASE_URL: path.join(dir, 'e2e.db'),
      UPLOAD_DIR: path.join(dir, 'uploads'),
      DUMP_DIR: path.join(dir, 'dumps'),
      SERVE_CLIENT: 'dist',
      SESSION_SECRET: 'e2e-secret-e2e-secret-e2e-secret-0000',
      SEED_DEMO: 'never',
      LOG_LEVEL: 'warn',
      // requests go straight to the server, where tests watch and intercept them; the offline test turns it on
      SERVICE_WORKER: 'off',
      ...env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout.on('data', (chunk) => (output += chunk));
  child.stderr.on('data', (chunk) => (output += chunk));
  const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
  let gone = false;
  void exited.then(() => (gone = true));

  const stop = async () => {
    if (!gone) {
      child.kill('SIGTERM');
      const timer = setTimeout(() => child.kill('SIGKILL'), 6000);
      await exited;
      clearTimeout(timer);
    }
    fs.rmSync(dir, { recursive: true, force: true });
  };

  const deadline = Date.now() + 45_000;
  while (true) {
    if (gone) {
      await stop();
      throw new Error(`The server exited before it was ready:\n${output}`);
    }
    try {
      const res = await fetch(`${url}/api/health`);
      if (res.ok) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) {
      await stop();
      throw new Error(`The server did not answer /api/health within 45 s:\n${output}`);
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  return { url, pid: child.pid!, dir, output: () => output, stop };
}
