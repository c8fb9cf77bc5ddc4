// Local-disk storage under the data folder: the embedded default.
import { mkdir, readFile, readdir, rm, stat, writeFile, rename } from 'node:fs/promises';
import { dirname, join, relative, resolve, sep } from 'node:path';
import { assertKey, type StorageDriver } from './storage-driver';

const types: Record<string, string> = { webp: 'image/webp', jpg: 'image/jpeg', jpeg: 'image/jpeg', png: 'image/png', avif: 'image/avif' };

export function localDiskStorage(root: string): StorageDriver {
  const base = resolve(root);
  const pathOf = (key: string) => {
    assertKey(key);
    return join(base, key);
  };
  return {
    async put(key, body) {
      const path = pathOf(key);
      await mkdir(dirname(path), { recursive: true });
      // Write then rename, so a reader never sees half a file.
      const temp = `${path}.${process.pid}.tmp`;
      await writeFile(temp, body);
      await rename(temp, path);
    },
    async get(key) {
      try {
        const body = await readFile(pathOf(key));
        const ext = key.split('.').pop() ?? '';
        return { body, contentType: types[ext] ?? 'application/octet-stream' };
      } catch (error) {
        if ((error as NodeJS.ErrnoException).code === 'ENOENT') return null;
        throw error;
      }
    },
    async delete(key) {
      await rm(pathOf(key), { force: true });
    },
    async *list(prefix) {
      const start = join(base, prefix);
      let entries: string[];
      try {
        entries = (await readdir(start, { recursive: true })) as string[];
      } catch (error) {
        if ((error as NodeJS.ErrnoException).code === 'ENOENT') return;
        throw error;
      }
      for (const entry of entries.sort()) {
        const path = join(start, entry);
        const info = await stat(path).catch(() => null);
        if (info?.isFile()) yield { key: relative(base, path).split(sep).join('/'), modifiedAt: info.mtime };
      }
    },
  };
}
