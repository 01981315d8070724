import fs from 'node:fs/promises';
import path from 'node:path';
import crypto from 'node:crypto';

export type Storage = {
  /** writes the file completely (fsync + rename) before resolving, so the database never points at a partial file */
  put: (id: string, data: Buffer) => Promise<void>;
  read: (id: string) => Promise<Buffer>;
  remove: (id: string) => Promise<void>;
  exists: (id: string) => Promise<boolean>;
  list: () => Promise<string[]>;
  dir: string;
};

const idPattern = /^[a-z0-9][a-z0-9_-]{10,80}(\.[a-z0-9]{2,5})?$/;

export function newFileId(): string {
  return crypto
    .randomBytes(16)
    .toString('base64url')
    .toLowerCase()
    .replace(/[^a-z0-9]/g, 'x');
}

export function createDiskStorage(dir: string): Storage {
  const resolve = (id: string) => {
    if (!idPattern.test(id)) throw new Error(`invalid file id ${JSON.stringify(id)}`);
    return path.join(dir, id);
  };
  return {
    dir,
    async put(id, data) {
      await fs.mkdir(dir, { recursive: true });
      const final = resolve(id);
      const tmp = path.join(dir, `.tmp-${crypto.randomBytes(6).toString('hex')}`);
      const handle = await fs.open(tmp, 'wx', 0o600);
      try {
        await handle.writeFile(data);
        await handle.sync();
      } finally {
        await handle.close();
      }
      await fs.rename(tmp, final);
    },
    read: (id) => fs.readFile(resolve(id)),
    async remove(id) {
      await fs.rm(resolve(id), { force: true });
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
  };
}
