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
import { bin, machineScratchDir } from '../../scripts/lib/paths.ts';
import type { Ports } from '../../scripts/lib/ports.ts';
import { runCommand, tail } from '../../scripts/lib/run.ts';
import { WEB_DIR } from '../../scripts/lib/stack.ts';

/** One entry of `.vite/manifest.json`, keyed by source path (or `_name-hash.js` for shared chunks). */
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

/**
 * Builds like scripts/lib/stack.ts buildWeb (production mode, its own scratch
 * folder so it never empties apps/web/dist or another run's build), with
 * `--manifest` added, which buildWeb has no way to pass.
 */
export async function buildWebWithManifest(ports: Ports): Promise<WebBuild> {
  const outDir = path.join(machineScratchDir(), `web-dist-bench-${ports.base}`);
  const env: NodeJS.ProcessEnv = { ...process.env };
  // A production build must not inherit NODE_ENV=test or development from a parent.
  delete env.NODE_ENV;
  const result = await runCommand(bin('vite'), ['build', '--outDir', outDir, '--emptyOutDir', '--manifest', '--bypass-lock'], { cwd: WEB_DIR, env, capture: true });
  if (result.code !== 0) throw new SetupError(`vite build of apps/web failed (exit ${result.code}):\n${tail(result.stdout + result.stderr, 30)}`);
  const manifestPath = path.join(outDir, '.vite', 'manifest.json');
  if (!fs.existsSync(manifestPath)) throw new SetupError(`vite build finished but ${manifestPath} is missing.`);
  const manifest = JSON.parse(fs.readFileSync(manifestPath, 'utf8')) as Manifest;
  const entryKey = Object.keys(manifest).find((key) => manifest[key]!.isEntry === true);
  if (entryKey === undefined) throw new SetupError('The Vite manifest names no entry chunk.');
  return { outDir, manifest, entryKey };
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
