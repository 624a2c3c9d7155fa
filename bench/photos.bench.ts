/**
 * The photo pipeline a listing's photos go through on upload (processPhoto:
 * read, turn upright, display size and thumbnail as WebP, average colour),
 * timed on 12-megapixel JPEGs like a phone camera's.
 */
import { performance } from 'node:perf_hooks';
import sharp from 'sharp';
import { processPhoto } from '../apps/api/src/modules/bundles/photo-pipeline.ts';
import type { BenchContext } from './lib/context.ts';
import { machineBusySeconds } from './lib/processes.ts';

const WIDTH = 4000;
const HEIGHT = 3000;
const RUNS = 5;
const TARGET_MS = 400;

/**
 * A fabric-like 4000 × 3000 photo: a plaid of coloured bands with woven
 * stripes and sensor-like noise, so it compresses like a real photo (several
 * megabytes), not like a flat colour. Each seed gives a different photo, so no
 * cache inside libvips can serve one run from another.
 */
async function fabricPhoto(seed: number, orientation: 1 | 6): Promise<Buffer> {
  const pixels = Buffer.alloc(WIDTH * HEIGHT * 3);
  let state = 0x9e3779b9 ^ seed;
  const base = [90 + ((seed * 37) % 90), 70 + ((seed * 53) % 110), 60 + ((seed * 71) % 120)];
  for (let y = 0; y < HEIGHT; y += 1) {
    const band = (y >> 6) & 3;
    for (let x = 0; x < WIDTH; x += 1) {
      // xorshift32: cheap noise, fine for texture.
      state ^= state << 13;
      state ^= state >>> 17;
      state ^= state << 5;
      const noise = (state & 31) - 16;
      const weave = ((x >> 2) + (y >> 2)) & 1 ? 10 : -10;
      const stripe = ((x >> 7) & 3) === band ? 45 : 0;
      const offset = (y * WIDTH + x) * 3;
      for (let channel = 0; channel < 3; channel += 1) {
        const value = base[channel]! + weave + noise + (channel === band % 3 ? stripe : stripe >> 2);
        pixels[offset + channel] = value < 0 ? 0 : value > 255 ? 255 : value;
      }
    }
  }
  return sharp(pixels, { raw: { width: WIDTH, height: HEIGHT, channels: 3 } })
    .jpeg({ quality: 88 })
    .withMetadata({ orientation })
    .toBuffer();
}

function percentile(sorted: number[], fraction: number): number {
  return sorted[Math.min(sorted.length - 1, Math.ceil(fraction * sorted.length) - 1)]!;
}

export async function run(ctx: BenchContext): Promise<void> {
  for (const { label, orientation } of [
    { label: 'landscape, upright', orientation: 1 },
    { label: 'portrait (EXIF orientation 6, turned on read)', orientation: 6 },
  ] as const) {
    const photos: Buffer[] = [];
    // One more photo than measured runs: the first warms up sharp and the JIT.
    for (let seed = 0; seed <= RUNS; seed += 1) photos.push(await fabricPhoto(seed + orientation * 100, orientation));
    await processPhoto(photos[0]!);

    const times: number[] = [];
    const cpuBefore = process.cpuUsage();
    const machineBefore = machineBusySeconds();
    const started = performance.now();
    for (const photo of photos.slice(1)) {
      const photoStarted = performance.now();
      await processPhoto(photo);
      times.push(performance.now() - photoStarted);
    }
    const elapsedSeconds = (performance.now() - started) / 1000;
    const cpu = process.cpuUsage(cpuBefore);
    const ownSeconds = (cpu.user + cpu.system) / 1e6;
    const otherCores = Math.max(0, machineBusySeconds() - machineBefore - ownSeconds) / elapsedSeconds;

    times.sort((a, b) => a - b);
    const averageMb = photos.slice(1).reduce((sum, photo) => sum + photo.length, 0) / RUNS / 1024 / 1024;
    ctx.print(`12 MP JPEG (${WIDTH} × ${HEIGHT}, ${averageMb.toFixed(1)} MB), ${label}`, {
      'median ms': percentile(times, 0.5),
      'p95 ms': percentile(times, 0.95),
      'target ms': TARGET_MS,
      'CPU ms per photo': (ownSeconds * 1000) / RUNS,
      'other programs, cores': otherCores,
      runs: RUNS,
    });
  }
}
