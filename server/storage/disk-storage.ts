import fs from 'node:fs/promises';
import path from 'node:path';
import crypto from 'node:crypto';

/** A file in the folder, a half-written one (`.tmp-…`, left by a crash) included, and when it last changed. */
export type StoredEntry = { name: string; temp: boolean; modifiedAt: number };

export type Storage = {
  /**
   * writes the file completely (fsync + rename) before resolving, so the database never points at a
   * partial file; a failed write leaves nothing behind
   */
  put: (id: string, data: Buffer) => Promise<void>;
  read: (id: string) => Promise<Buffer>;
  /** removes a stored file, or a half-written one by its entry name */
  remove: (id: string) => Promise<void>;
  exists: (id: string) => Promise<boolean>;
  list: () => Promise<string[]>;
  entries: () => Promise<StoredEntry[]>;
  dir: string;
};

const idPattern = /^[a-z0-9][a-z0-9_-]{10,80}(\.[a-z0-9]{2,5})?$/;
const tempPattern = /^\.tmp-[0-9a-f]{12}$/;

export function newFileId(): string {
  return crypto
    .randomBytes(16)
    .toString('base64url')
    .toLowerCase()
    .replace(/[^a-z0-9]/g, 'x');
}

export function createDiskStorage(dir: string): Storage {
  const resolve = (id: string, { temp = false } = {}) => {
    if (!idPattern.test(id) && !(temp && tempPattern.test(id))) throw new Error(`invalid file id ${JSON.stringify(id)}`);
    return path.join(dir, id);
  };
  return {
    dir,
    async put(id, data) {
      await fs.mkdir(dir, { recursive: true });
      const final = resolve(id);
      const tmp = path.join(dir, `.tmp-${crypto.randomBytes(6).toString('hex')}`);
      try {
        const handle = await fs.open(tmp, 'wx', 0o600);
        try {
          await handle.writeFile(data);
          await handle.sync();
        } finally {
          await handle.close();
        }
        await fs.rename(tmp, final);
      } catch (err) {
        await fs.rm(tmp, { force: true });
        throw err;
      }
    },
    read: (id) => fs.readFile(resolve(id)),
    async remove(id) {
      await fs.rm(resolve(id, { temp: true }), { force: true });
    },
    async exists(id) {
      try {
        await fs.access(resolve(id));
        return true;
      } catch {
        return false;
      }
    },
    async list() {
      try {
        return (await fs.readdir(dir)).filter((f) => !f.startsWith('.'));
      } catch {
        return [];
      }
    },
    async entries() {
      let names: string[];
      try {
        names = await fs.readdir(dir);
      } catch {
        return [];
      }
      const out: StoredEntry[] = [];
      for (const name of names) {
        const temp = tempPattern.test(name);
        if (!temp && !idPattern.test(name)) continue;
        const stat = await fs.stat(path.join(dir, name)).catch(() => null);
        if (stat?.isFile()) out.push({ name, temp, modifiedAt: stat.mtimeMs });
      }
      return out;
    },
  };
}
