/**
 * The shared domain functions the listing form and the shelf call on every
 * keystroke or page: how many calls per second one core manages.
 */
import {
  averageColour,
  DEFAULT_POSTAGE_TABLE,
  estimateYield,
  ledgerEntriesForPaidOrder,
  orderMoney,
  planBundle,
  quotePostage,
  suggestColour,
  type Piece,
} from '@scrap-relay/shared';
import type { BenchContext } from './lib/context.ts';
import { timeCalls } from './lib/timing.ts';

const MM_PER_INCH = 25.4;
const inches = (value: number) => Math.round(value * MM_PER_INCH);

/** A seller's listed pieces: a fat quarter, a fat eighth, yardage offcuts and odd strips. */
const pieces: Piece[] = [
  { widthMm: inches(18), heightMm: inches(22), count: 2 },
  { widthMm: inches(9), heightMm: inches(22), count: 3 },
  { widthMm: inches(12), heightMm: inches(42), count: 1 },
  { widthMm: inches(6), heightMm: inches(40), count: 4 },
  { widthMm: inches(3), heightMm: inches(30), count: 6 },
  { widthMm: inches(11), heightMm: inches(11), count: 2 },
  { widthMm: inches(5.5), heightMm: inches(16), count: 5 },
  { widthMm: inches(2.75), heightMm: inches(44), count: 8 },
];

/** RGB bytes of a 1600 × 1200 photo-sized image (a colour gradient). */
function photoPixels(width: number, height: number): Uint8Array {
  const pixels = new Uint8Array(width * height * 3);
  for (let y = 0; y < height; y += 1) {
    for (let x = 0; x < width; x += 1) {
      const offset = (y * width + x) * 3;
      pixels[offset] = (x * 255) / width;
      pixels[offset + 1] = (y * 255) / height;
      pixels[offset + 2] = 160;
    }
  }
  return pixels;
}

export async function run(ctx: BenchContext): Promise<void> {
  const report = (label: string, fn: (call: number) => unknown) => {
    const figures = timeCalls(fn);
    ctx.print(label, { 'calls/s': figures.callsPerSecond, 'p50 µs': figures.p50Us, 'p95 µs': figures.p95Us });
  };

  // Inputs vary from call to call (by the call's index) so no result can be computed once and reused.
  report('yield estimate, ½ to 3 lb of quilting cotton', (call) => estimateYield({ grams: 227 + (call % 64) * 20, fibre: 'quilting_cotton' }));
  report(`cut plan, ${pieces.length} listed pieces`, (call) => planBundle(call % 2 === 0 ? pieces : pieces.slice(1)));
  const items = Array.from({ length: 6 }, (_, index) => ({ ref: `bundle ${index + 1}`, grams: 250 + index * 180 }));
  report('postage quote, 6 bundles from one seller', (call) =>
    quotePostage({ table: DEFAULT_POSTAGE_TABLE, items: items.slice(call % 3), postalCode: '97301', currency: 'USD', locale: 'en-US' }),
  );
  report('order money and ledger entries, 3 bundles', (call) =>
    ledgerEntriesForPaidOrder({
      sellerId: 'member-1',
      money: orderMoney({
        lines: [
          { priceMinor: 1200 + (call % 64), quantity: 1 },
          { priceMinor: 850, quantity: 2 },
          { priceMinor: 0, quantity: 1 },
        ],
        postageMinor: 990,
        guildFeeBasisPoints: 1000,
      }),
    }),
  );
  const photo = photoPixels(1600, 1200);
  report('average colour + suggestion, one 1600 × 1200 photo', () => {
    const average = averageColour(photo, 3);
    return average === null ? null : suggestColour(average);
  });
}
