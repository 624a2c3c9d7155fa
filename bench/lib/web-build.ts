/**
 * Builds apps/web with Vite's manifest and weighs what a browser must fetch
 * for a page: the entry chunk, the route's lazy chunk, and every chunk either
 * imports statically (those load before the page can render; dynamic imports
 * load later, on demand).
 */
import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';
import { SetupError } from '../../scripts/lib/errors.ts';
import type { Ports } from '../../scripts/lib/ports.ts';
import { buildWeb } from '../../scripts/lib/stack.ts';
import { readManifest, type Manifest } from '../../apps/api/src/middleware/vite-manifest.ts';

export { staticClosure, type Manifest, type ManifestChunk } from '../../apps/api/src/middleware/vite-manifest.ts';

export interface WebBuild {
  outDir: string;
  manifest: Manifest;
  /** The key of the HTML entry (index.html). */
  entryKey: string;
}

export interface Weight {
  raw: number;
  gzip: number;
  brotli: number;
}

/** The production build `npm test` serves (scripts/lib/stack.ts `buildWeb`), with the manifest Vite writes beside it. */
export async function buildWebWithManifest(ports: Ports): Promise<WebBuild> {
  const outDir = await buildWeb(ports);
  const manifest = readManifest(outDir);
  if (manifest === undefined) throw new SetupError(`vite build finished but ${outDir}/.vite/manifest.json is missing.`);
  const entryKey = Object.keys(manifest).find((key) => manifest[key]!.isEntry === true);
  if (entryKey === undefined) throw new SetupError('The Vite manifest names no entry chunk.');
  return { outDir, manifest, entryKey };
}

export function weigh(content: Buffer): Weight {
  return {
    raw: content.length,
    gzip: zlib.gzipSync(content, { level: 9 }).length,
    brotli: zlib.brotliCompressSync(content, {
      params: { [zlib.constants.BROTLI_PARAM_QUALITY]: zlib.constants.BROTLI_MAX_QUALITY, [zlib.constants.BROTLI_PARAM_SIZE_HINT]: content.length },
    }).length,
  };
}

/** Each file weighed alone (as it goes over the wire, one response per file), then summed. */
export function weighFiles(outDir: string, files: Iterable<string>): Weight {
  const total: Weight = { raw: 0, gzip: 0, brotli: 0 };
  for (const file of new Set(files)) {
    const weight = weigh(fs.readFileSync(path.join(outDir, file)));
    total.raw += weight.raw;
    total.gzip += weight.gzip;
    total.brotli += weight.brotli;
  }
  return total;
}

/** The JavaScript files of a set of manifest chunks. */
export const filesOf = (manifest: Manifest, keys: Iterable<string>): string[] => [...keys].map((key) => manifest[key]!.file);

/** Every lazily loaded route module under apps/web/src/app/routes/, by manifest key. */
export function routeModules(manifest: Manifest): string[] {
  return Object.keys(manifest)
    .filter((key) => key.startsWith('src/app/routes/') && manifest[key]!.isDynamicEntry === true)
    .sort();
}

/** Every stylesheet the build wrote. */
export function cssFiles(outDir: string): string[] {
  return fs
    .readdirSync(path.join(outDir, 'assets'))
    .filter((file) => file.endsWith('.css'))
    .map((file) => path.join('assets', file));
}
