/**
 * Compiles the API for production into one ES module: our code and @scrap-relay/shared bundled,
 * every installed package left to `node_modules`. Run as `npm run build -w apps/api`
 * (writes apps/api/dist/server.js) and start it with `node apps/api/dist/server.js`.
 * Plain Node serves it, without tsx's loader thread and its compile step at boot.
 */
import { randomUUID } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { build } from 'esbuild';

const apiDir = import.meta.dirname;
const readDependencies = (file: string) => Object.keys((JSON.parse(fs.readFileSync(file, 'utf8')) as { dependencies?: Record<string, string> }).dependencies ?? {});

/** Bundles src/server.ts into `outFile` (with a source map beside it) and returns the file's path. */
export async function buildApi(outFile = path.join(apiDir, 'dist', 'server.js')): Promise<string> {
  const external = [...readDependencies(path.join(apiDir, 'package.json')), ...readDependencies(path.join(apiDir, '../../packages/shared/package.json'))].filter(
    (name) => !name.startsWith('@scrap-relay/'),
  );
  await build({
    entryPoints: [path.join(apiDir, 'src', 'server.ts')],
    outfile: outFile,
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    external,
    sourcemap: true,
    logLevel: 'warning',
    // Names this build, for what it keeps in the database in its own shape (kept shelf pages).
    define: { 'process.env.SR_BUILD_ID': JSON.stringify(randomUUID()) },
  });
  return outFile;
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const outFile = await buildApi(process.argv[2]);
  console.log(`API built: ${path.relative(process.cwd(), outFile)}`);
}
