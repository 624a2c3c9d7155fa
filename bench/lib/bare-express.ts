/**
 * A bare Express app with JSON routes and nothing else (no session, no
 * database): the floor the API's own figures are compared with. Run as its
 * own process so the load generator does not share its event loop.
 */
import express from 'express';

const port = Number(process.env.PORT);
if (!Number.isInteger(port) || port <= 0) throw new Error('Set PORT to run the bare Express baseline.');

/** A page of 24 shelf-card-sized objects, to price JSON serialisation at realistic size. */
const page = Array.from({ length: 24 }, (_, index) => ({
  id: `bundle-${index + 1}`,
  title: `Blue and cream 2½-inch strips, lot ${index + 1}`,
  offer: index % 3 === 0 ? 'postage_only' : 'sale',
  priceMinor: 800 + index * 25,
  currency: 'USD',
  grams: 450 + index * 10,
  fibre: 'quilting_cotton',
  colourValue: 'medium',
  colourFamily: 'cool',
  yieldEstimate: { squares5in: 48 + index, strips2_5inWof: 11 },
  photo: { url: `/uploads/bundle-${index + 1}-thumb.webp`, width: 480, height: 360 },
  seller: { id: `member-${index % 6}`, name: 'A guild member' },
}));

const app = express();
app.get('/baseline/health', (_req, res) => {
  res.json({ status: 'ok' });
});
app.get('/baseline/page', (_req, res) => {
  res.json({ bundles: page, nextCursor: null });
});

const server = app.listen(port, '127.0.0.1', () => console.log(`bare Express baseline on http://127.0.0.1:${port}`));
const stop = () => server.close(() => process.exit(0));
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
