import { createReadStream, createWriteStream } from 'node:fs';
import { mkdir, readdir, rename, rm, stat, copyFile, unlink } from 'node:fs/promises';
import path from 'node:path';
import type { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { assertKey, type Storage, type StoredObject } from './storage';

/** Storage in a folder on local disk (config.storageDir). Objects are plain files; temp space is `<root>/tmp`. */
export function localDiskStorage(rootDir: string): Storage {
  const root = path.resolve(rootDir);
  const objectsRoot = path.join(root, 'objects');
  const tempDir = path.join(root, 'tmp');

  const fileOf = (key: string) => {
    assertKey(key);
    return path.join(objectsRoot, ...key.split('/'));
  };

  async function statKey(key: string): Promise<StoredObject | null> {
    try {
      const s = await stat(fileOf(key));
      return s.isFile() ? { key, sizeBytes: s.size, modifiedAt: s.mtime } : null;
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code === 'ENOENT') return null;
      throw err;
    }
  }

  async function walk(dir: string, base: string, out: string[]): Promise<void> {
    let entries;
    try {
      entries = await readdir(dir, { withFileTypes: true });
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code === 'ENOENT') return;
      throw err;
    }
    for (const e of entries) {
      const rel = base ? `${base}/${e.name}` : e.name;
      if (e.isDirectory()) await walk(path.join(dir, e.name), rel, out);
      else out.push(rel);
    }
  }

  return {
    kind: 'local',
    tempDir,
    async put(key, body: Readable) {
      const file = fileOf(key);
      await mkdir(path.dirname(file), { recursive: true });
      // Write beside the target and rename, so a reader never sees half a file.
      const partial = `${file}.partial-${process.pid}-${Date.now()}`;
      try {
        await pipeline(body, createWriteStream(partial));
        await rename(partial, file);
      } catch (err) {
        await rm(partial, { force: true });
        throw err;
      }
      return (await statKey(key))!;
    },
    async putFile(key, localPath) {
      const file = fileOf(key);
      await mkdir(path.dirname(file), { recursive: true });
      try {
        await rename(localPath, file);
      } catch (err) {
        if ((err as NodeJS.ErrnoException).code !== 'EXDEV') throw err;
        await copyFile(localPath, file);
        await unlink(localPath);
      }
      return (await statKey(key))!;
    },
    async putDirectory(prefix, localDir) {
      if (!prefix.endsWith('/')) throw new Error(`putDirectory needs a prefix ending in '/': ${prefix}`);
      const target = fileOf(prefix.slice(0, -1));
      await mkdir(path.dirname(target), { recursive: true });
      await rm(target, { recursive: true, force: true });
      try {
        await rename(localDir, target);
      } catch (err) {
        if ((err as NodeJS.ErrnoException).code !== 'EXDEV') throw err;
        await mkdir(target, { recursive: true });
        for (const name of await readdir(localDir)) await this.putFile(`${prefix}${name}`, path.join(localDir, name));
      }
      const names = (await readdir(target)).sort();
      return Promise.all(
        names.map(async (name) => {
          const s = await stat(path.join(target, name));
          return { key: `${prefix}${name}`, sizeBytes: s.size, modifiedAt: s.mtime };
        }),
      );
    },
    async get(key) {
      const file = fileOf(key);
      await stat(file);
      return createReadStream(file);
    },
    stat: statKey,
    async delete(key) {
      await rm(fileOf(key), { force: true });
    },
    async deletePrefix(prefix) {
      // A prefix that ends at a folder boundary removes the folder in one go.
      if (prefix.endsWith('/')) {
        assertKey(prefix.slice(0, -1));
        await rm(path.join(objectsRoot, ...prefix.slice(0, -1).split('/')), { recursive: true, force: true });
        return;
      }
      for (const key of await this.list(prefix)) await rm(fileOf(key), { force: true });
    },
    async list(prefix) {
      const dirPart = prefix.includes('/') ? prefix.slice(0, prefix.lastIndexOf('/')) : '';
      if (dirPart) assertKey(dirPart);
      const out: string[] = [];
      await walk(dirPart ? path.join(objectsRoot, ...dirPart.split('/')) : objectsRoot, dirPart, out);
      return out.filter((k) => k.startsWith(prefix) && !k.includes('.partial-')).sort();
    },
    async localPath(key) {
      return fileOf(key);
    },
    async mediaInput(key) {
      return fileOf(key);
    },
    async localCopy(key) {
      return { path: fileOf(key), release: async () => {} };
    },
  };
}
