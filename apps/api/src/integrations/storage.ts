import fs from 'node:fs/promises';
import path from 'node:path';

/**
 * Where uploaded files live. The local folder is the default; an S3-compatible store can
 * implement the same three methods later. Keys are made by us, never taken from a request.
 */
export interface FileStorage {
  put(key: string, data: Buffer): Promise<void>;
  remove(key: string): Promise<void>;
  publicUrl(key: string): string;
}

const SAFE_KEY = /^[a-z0-9][a-z0-9/_.-]*$/;

export function localStorage(root: string, publicBase = '/uploads'): FileStorage {
  const resolve = (key: string) => {
    if (!SAFE_KEY.test(key) || key.includes('..')) throw new Error(`unsafe storage key ${key}`);
    return path.join(root, key);
  };
  return {
    async put(key, data) {
      const file = resolve(key);
      await fs.mkdir(path.dirname(file), { recursive: true });
      await fs.writeFile(file, data);
    },
    async remove(key) {
      await fs.rm(resolve(key), { force: true });
    },
    publicUrl: (key) => `${publicBase}/${key}`,
  };
}
