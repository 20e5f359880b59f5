import { mkdir, readdir, readFile, rename, rm, stat, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { randomUUID } from 'node:crypto';

/** Where photo bytes live. The database keeps only keys, so another store (an object store) can stand in. */
export interface PhotoStorage {
  put(key: string, bytes: Buffer): Promise<void>;
  /** The bytes, or null when nothing is stored under the key. */
  get(key: string): Promise<Buffer | null>;
  /** Removing a key that is not there is not an error (a refused upload cleans up what it may have written). */
  delete(key: string): Promise<void>;
  /** Every stored key with when it was last written (the orphan sweep leaves young files alone). */
  list(): Promise<{ key: string; modifiedAt: Date }[]>;
}

// Keys are made by the server, but a strict shape keeps any path trick out of the folder store.
const KEY_SHAPE = /^[a-z0-9][a-z0-9.-]{0,99}$/;

function checkedKey(key: string): string {
  if (!KEY_SHAPE.test(key) || key.includes('..')) throw new Error(`bad photo storage key: ${key}`);
  return key;
}

/** A folder on disk, outside the checkout. Writes go to a temporary name first, so a reader never sees half a file. */
export function folderPhotoStorage(folder: string): PhotoStorage {
  const file = (key: string) => path.join(folder, checkedKey(key));
  return {
    async put(key, bytes) {
      await mkdir(folder, { recursive: true, mode: 0o700 });
      const tmp = path.join(folder, `.tmp-${randomUUID()}`);
      await writeFile(tmp, bytes, { mode: 0o600 });
      await rename(tmp, file(key));
    },
    async get(key) {
      try {
        return await readFile(file(key));
      } catch (err) {
        if ((err as NodeJS.ErrnoException).code === 'ENOENT') return null;
        throw err;
      }
    },
    async delete(key) {
      await rm(file(key), { force: true });
    },
    async list() {
      let names: string[];
      try {
        names = await readdir(folder);
      } catch (err) {
        if ((err as NodeJS.ErrnoException).code === 'ENOENT') return [];
        throw err;
      }
      const out: { key: string; modifiedAt: Date }[] = [];
      // Half-written temporary files (".tmp-…") are not keys; anything else of a foreign shape is left alone too.
      for (const name of names.filter((n) => KEY_SHAPE.test(n) && !n.includes('..'))) {
        try {
          out.push({ key: name, modifiedAt: (await stat(path.join(folder, name))).mtime });
        } catch (err) {
          // Deleted between the listing and the stat: nothing to report.
          if ((err as NodeJS.ErrnoException).code !== 'ENOENT') throw err;
        }
      }
      return out;
    },
  };
}

/** The default store: `<data folder>/photos`, the same data folder the scripts use for MariaDB and backups. */
export function defaultPhotoStorage(dataDir: string | null): PhotoStorage {
  const root = dataDir ?? path.join(process.env.XDG_DATA_HOME || path.join(os.homedir(), '.local', 'share'), 'loftbench');
  return folderPhotoStorage(path.join(path.resolve(root), 'photos'));
}
