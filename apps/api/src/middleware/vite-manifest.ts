import fs from 'node:fs';
import path from 'node:path';

/** One entry of Vite's `.vite/manifest.json`, keyed by source path (or `_name-hash.js` for shared chunks). */
export interface ManifestChunk {
  file: string;
  src?: string;
  isEntry?: boolean;
  isDynamicEntry?: boolean;
  imports?: string[];
  dynamicImports?: string[];
  css?: string[];
}

export type Manifest = Record<string, ManifestChunk>;

/** The manifest a production build of the web app writes beside it (`build.manifest` in apps/web/vite.config.ts), if any. */
export function readManifest(dist: string): Manifest | undefined {
  const file = path.join(dist, '.vite', 'manifest.json');
  return fs.existsSync(file) ? (JSON.parse(fs.readFileSync(file, 'utf8')) as Manifest) : undefined;
}

/** The chunks `keys` need before they run: themselves and their static imports, transitively. */
export function staticClosure(manifest: Manifest, keys: readonly string[]): Set<string> {
  const seen = new Set<string>();
  const queue = [...keys];
  while (queue.length > 0) {
    const key = queue.pop()!;
    if (seen.has(key)) continue;
    const chunk = manifest[key];
    if (chunk === undefined) throw new Error(`The Vite manifest has no chunk ${key}.`);
    seen.add(key);
    queue.push(...(chunk.imports ?? []));
  }
  return seen;
}

/** The files a lazy route module needs that the entry chunk does not already bring, as addresses (`/assets/…`). */
export function routeOnlyFiles(manifest: Manifest, routeKey: string): string[] {
  const entryKey = Object.keys(manifest).find((key) => manifest[key]!.isEntry === true);
  if (entryKey === undefined || manifest[routeKey] === undefined) return [];
  const entry = staticClosure(manifest, [entryKey]);
  return [...staticClosure(manifest, [routeKey])].filter((key) => !entry.has(key)).map((key) => `/${manifest[key]!.file}`);
}
