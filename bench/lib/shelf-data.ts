/**
 * Fills the bench database with an invented guild's shelf: 500 members and
 * 100 000 bundles on the shelf, each with one photo row. Everything is
 * generated inside PostgreSQL with generate_series (one INSERT per table), so
 * loading takes seconds, not the minutes row-by-row inserts would.
 */
import fs from 'node:fs';
import path from 'node:path';
import pg from 'pg';
import sharp from 'sharp';
import { CUT_KINDS, FIBRES, type ColourFamily, type ColourValue, type CutKind, type Fibre, type Offer } from '@scrap-relay/shared';

export const SHELF_BUNDLES = 100_000;

const BUNDLE_TALLY_TRIGGERS = ['bundles_office_tally_insert', 'bundles_office_tally_update'];
export const SHELF_SELLERS = 500;

/** Every invented seller signs in with this password. */
export const BENCH_PASSWORD = 'shelf-bench-quilter';
/** argon2id of BENCH_PASSWORD, made once with apps/api/src/auth/passwords.ts hashPassword: hashing 500 times would take minutes. */
const BENCH_PASSWORD_HASH = '$argon2id$v=19$m=19456,t=2,p=1$LeLuc0zpl8r8q1mnFOvzxg$QfK9qKcCdeombyWR61IDzvWHi9EiEKqS1vItvktzb+Q';

const EMAIL_DOMAIN = 'shelf-bench.example';
export const benchSellerEmail = (n: number) => `quilter-${String(n).padStart(3, '0')}@${EMAIL_DOMAIN}`;

/** Every bundle points at the same two small files: the shelf reads photo keys, never the photos. */
const DISPLAY_KEY = 'bench/shelf-display.webp';
const THUMB_KEY = 'bench/shelf-thumb.webp';

/**
 * A weighted list spelled out, one entry per percent, so SQL can pick from it
 * with one random number: `list[1 + floor(r * cardinality(list))]`.
 */
function weighted<T extends string>(weights: Partial<Record<T, number>>): T[] {
  const entries = Object.entries(weights) as [T, number][];
  const total = entries.reduce((sum, [, weight]) => sum + weight, 0);
  if (total !== 100) throw new Error(`weights must add up to 100, not ${total}`);
  return entries.flatMap(([value, weight]) => Array<T>(weight).fill(value));
}

// Shares chosen to resemble a guild's shelf: mostly quilting cotton, sales the largest offer.
const OFFER_DRAW = weighted<Offer>({ sale: 55, postage_only: 25, meeting: 20 });
const FIBRE_DRAW = weighted<Fibre>({ quilting_cotton: 50, batik: 12, flannel: 10, linen: 6, lawn_voile: 5, wool: 4, knit: 3, mixed_unknown: 10 });
const VALUE_DRAW = weighted<ColourValue>({ light: 25, medium: 35, dark: 25, mixed: 15 });
const FAMILY_DRAW = weighted<ColourFamily>({ warm: 25, cool: 25, neutral: 20, black_white: 10, multi: 20 });
const KIND_DRAW = weighted<CutKind>({
  strips: 22,
  squares: 18,
  fat_quarters: 12,
  fat_eighths: 6,
  yardage: 10,
  improv: 12,
  selvages: 3,
  orphan_blocks: 5,
  epp_shapes: 4,
  binding: 4,
  batting: 4,
});

/** How each cut kind reads in a title. */
const KIND_WORDS: Record<CutKind, string> = {
  strips: '2½-inch strips',
  squares: '5-inch squares',
  fat_quarters: 'fat quarters',
  fat_eighths: 'fat eighths',
  yardage: 'yardage remnants',
  improv: 'improv scraps',
  selvages: 'selvages',
  orphan_blocks: 'orphan blocks',
  epp_shapes: 'English paper piecing hexagons',
  binding: 'leftover binding',
  batting: 'batting offcuts',
};
const FIBRE_WORDS: Record<Fibre, string> = {
  quilting_cotton: 'quilting cotton',
  batik: 'batik',
  flannel: 'flannel',
  linen: 'linen blend',
  lawn_voile: 'lawn',
  wool: 'wool',
  knit: 'knit',
  mixed_unknown: 'mixed fabrics',
};
const VALUE_WORDS: Record<ColourValue, string[]> = {
  light: ['Soft', 'Pale', 'Light', 'Airy'],
  medium: ['Mid-tone', 'Medium', 'Everyday', 'Cheerful'],
  dark: ['Dark', 'Deep', 'Moody', 'Rich'],
  mixed: ['Scrappy', 'Mixed', 'Assorted', 'Grab-bag'],
};
const FAMILY_WORDS: Record<ColourFamily, string[]> = {
  warm: ['reds and oranges', 'golds and rusts', 'pinks and corals'],
  cool: ['blues and greens', 'teals and navies', 'purples and aquas'],
  neutral: ['creams and tans', 'greys and taupes', 'low-volume prints'],
  black_white: ['black and white prints', 'text prints', 'monochrome prints'],
  multi: ['rainbow prints', 'novelty prints', 'florals and dots'],
};
const PROJECTS = ['a log cabin quilt', 'a churn dash sampler', 'flying geese blocks', 'a nine-patch baby quilt', 'half-square triangles', 'a medallion quilt', 'a hexagon table runner', 'a string-pieced throw'];
const USES = ['scrappy binding', 'cutting into 2½-inch strips', 'a postage-stamp quilt', 'string blocks', 'crumb piecing', 'a charity quilt top', 'appliqué', 'pincushions and mug rugs', 'a scrappy border'];
const GIVEN_NAMES = ['Marigold', 'Hattie', 'Odile', 'Bram', 'Wren', 'Juniper', 'Pell', 'Ines', 'Corwin', 'Delphine', 'Tamsin', 'Ansel', 'Ottoline', 'Jory', 'Minna', 'Silas', 'Briony', 'Fenn', 'Ysolde', 'Calloway'];
const SURNAMES = ['Fenwick', 'Halloran', 'Thistlewood', 'Marchbank', 'Quillon', 'Ashgrove', 'Pennicott', 'Larkspur', 'Dunmore', 'Whitcombe', 'Brackley', 'Ollerton', 'Varga', 'Haverill', 'Nettleby', 'Corrigan', 'Saltmarsh', 'Tindall', 'Renshaw', 'Elbury'];

/** Picks from a text[] parameter with a random number in [0, 1). */
const pick = (list: string, r: string) => `(${list})[1 + floor(${r} * cardinality(${list}))::int]`;

export interface ShelfLoad {
  /** False when the database already held the bundles. */
  loaded: boolean;
  seconds: number;
  bundlesOnShelf: number;
}

async function writeSharedPhotos(uploadDir: string): Promise<{ width: number; height: number; averageHex: string }> {
  fs.mkdirSync(path.join(uploadDir, 'bench'), { recursive: true });
  // Two colour blocks, so the files are real images of the sizes the photo pipeline makes.
  const swatch = (width: number) => {
    const height = Math.round(width * 0.75);
    const block = { create: { width: Math.round(width / 2), height, channels: 3 as const, background: { r: 214, g: 196, b: 160 } } };
    return sharp({ create: { width, height, channels: 3, background: { r: 52, g: 86, b: 120 } } }).composite([{ input: block, left: 0, top: 0 }]);
  };
  await swatch(1600).webp({ quality: 80 }).toFile(path.join(uploadDir, DISPLAY_KEY));
  const thumbPath = path.join(uploadDir, THUMB_KEY);
  const thumb = await swatch(400).webp({ quality: 72 }).toFile(thumbPath);
  const { channels } = await sharp(thumbPath).stats();
  const hex = channels
    .slice(0, 3)
    .map((channel) => Math.round(channel.mean).toString(16).padStart(2, '0'))
    .join('');
  return { width: thumb.width, height: thumb.height, averageHex: `#${hex}` };
}

/**
 * Loads the invented shelf unless it is already there, then refreshes the
 * planner's statistics and the visibility map (autovacuum would do both
 * after a bulk insert on a real server, but not within the benchmark's minute).
 */
export async function loadShelf(databaseUrl: string, uploadDir: string): Promise<ShelfLoad> {
  const started = Date.now();
  const photo = await writeSharedPhotos(uploadDir);
  const client = new pg.Client({ connectionString: databaseUrl, application_name: 'scrap-relay-bench-loader' });
  await client.connect();
  try {
    const count = async () =>
      (
        await client.query<{ n: number }>(
          `SELECT count(*)::int AS n FROM bundles b JOIN members m ON m.id = b.seller_id WHERE b.state = 'on_shelf' AND m.email LIKE $1`,
          [`%@${EMAIL_DOMAIN}`],
        )
      ).rows[0]!.n;
    const already = await count();
    if (already >= SHELF_BUNDLES) return { loaded: false, seconds: (Date.now() - started) / 1000, bundlesOnShelf: already };
    if (already > 0) throw new Error(`The bench database holds ${already} invented bundles, fewer than ${SHELF_BUNDLES}; recreate it.`);

    await client.query('BEGIN');
    // The guild office's tally triggers on bundles (migration 20261202120000-office-tallies.ts) would fire
    // once per loaded row; they are off for this bulk load, and the tallies are rebuilt once at the end.
    for (const trigger of BUNDLE_TALLY_TRIGGERS) await client.query(`ALTER TABLE bundles DISABLE TRIGGER ${trigger}`);
    await client.query(
      `INSERT INTO guild (id, name, town, currency, invite_code)
       VALUES (1, 'Ferncombe Patchwork Guild', 'Ferncombe', 'USD', 'FERNCOMBE-BENCH')
       ON CONFLICT (id) DO NOTHING`,
    );
    await client.query(
      `INSERT INTO members (name, email, password_hash, roles, joined_at, email_verified_at)
       SELECT ($1::text[])[1 + n % cardinality($1::text[])] || ' ' || ($2::text[])[1 + (n / cardinality($1::text[])) % cardinality($2::text[])],
              'quilter-' || lpad(n::text, 3, '0') || '@' || $3::text,
              $4, ARRAY['member'], now() - (n % 60) * interval '1 month', now() - (n % 60) * interval '1 month'
       FROM generate_series(1, $5::int) AS n
       ON CONFLICT (lower(email)) DO NOTHING`,
      [GIVEN_NAMES, SURNAMES, EMAIL_DOMAIN, BENCH_PASSWORD_HASH, SHELF_SELLERS],
    );
    // A fixed seed makes every run load the same shelf, so figures from different runs compare.
    await client.query('SELECT setseed(0.2026)');
    await client.query(
      `WITH sellers AS (
         SELECT id, row_number() OVER (ORDER BY email)::int AS n FROM members WHERE email LIKE '%@' || $9::text
       ),
       draws AS (
         -- random() is volatile, so this CTE is computed once per row and every column below sees the same draws.
         SELECT i, random() AS r_offer, random() AS r_fibre, random() AS r_value, random() AS r_family,
                random() AS r_kind, random() AS r_second, random() AS r_weight, random() AS r_price, random() AS r_age,
                random() AS r_seller, random() AS r_value_word, random() AS r_family_word, random() AS r_project,
                random() AS r_use, random() AS r_quantity, random() AS r_flags
         FROM generate_series(1, $10::int) AS i
       ),
       shaped AS (
         SELECT d.*,
                ${pick('$1::text[]', 'r_offer')} AS offer,
                ${pick('$2::text[]', 'r_fibre')} AS fibre,
                ${pick('$3::text[]', 'r_value')} AS colour_value,
                ${pick('$4::text[]', 'r_family')} AS colour_family,
                array_position($6::text[], ${pick('$5::text[]', 'r_kind')}) AS kind_index,
                100 + floor(power(r_weight, 1.6) * 2900)::int AS weight_grams,
                now() - r_age * interval '89 days' - i * interval '1 millisecond' AS on_shelf_at,
                1 + floor(power(r_seller, 2) * $11::int)::int AS seller_n
         FROM draws d
       ),
       worded AS (
         SELECT s.*,
                -- About 45 % of bundles hold a second cut kind, always a different one.
                CASE WHEN r_second < 0.45 THEN 1 + (kind_index + floor(r_second * 22)::int) % cardinality($6::text[]) END AS second_index,
                $12::jsonb->colour_value->>floor(r_value_word * jsonb_array_length($12::jsonb->colour_value))::int AS value_word,
                $13::jsonb->colour_family->>floor(r_family_word * jsonb_array_length($13::jsonb->colour_family))::int AS family_word
         FROM shaped s
       ),
       titled AS (
         SELECT w.*,
                value_word || ' ' || ($7::text[])[kind_index]
                  || CASE WHEN second_index IS NULL THEN '' ELSE ' and ' || ($7::text[])[second_index] END AS title_start
         FROM worded w
       )
       INSERT INTO bundles (seller_id, state, title, description, offer, price_minor, currency, meeting_handover_ok,
                            quantity, quantity_available, weight_grams, fibre, cut_kinds, colour_value, colour_family,
                            prewashed, smoke_free, pet_free, submitted_at, reviewed_at, on_shelf_at, expires_at, created_at, updated_at)
       SELECT sellers.id, 'on_shelf',
              -- Titles stay within the listing form's 80 characters.
              CASE WHEN length(title_start || ' in ' || family_word) <= 80 THEN title_start || ' in ' || family_word ELSE title_start END,
              'Left over from ' || ($14::text[])[1 + floor(r_project * cardinality($14::text[]))::int] || ' in '
                || ($8::text[])[array_position($15::text[], fibre)] || '. '
                || 'Good for ' || ($16::text[])[1 + floor(r_use * cardinality($16::text[]))::int] || '. '
                || CASE WHEN r_flags < 0.5 THEN 'Prewashed and pressed. ' ELSE 'Not prewashed. ' END
                || 'Pins and needles removed; no damage or odours.',
              offer,
              CASE WHEN offer = 'sale' THEN (12 + floor(r_price * 148)::int) * 25 END,
              'USD',
              offer = 'sale' AND r_price < 0.3,
              CASE WHEN r_quantity < 0.9 THEN 1 ELSE 2 + floor((r_quantity - 0.9) * 80)::int END,
              CASE WHEN r_quantity < 0.9 THEN 1 ELSE 2 + floor((r_quantity - 0.9) * 80)::int END,
              weight_grams, fibre,
              ARRAY[($6::text[])[kind_index]] || CASE WHEN second_index IS NULL THEN ARRAY[]::text[] ELSE ARRAY[($6::text[])[second_index]] END,
              colour_value, colour_family,
              r_flags < 0.5, r_flags < 0.8, r_flags > 0.35,
              on_shelf_at - interval '2 days', on_shelf_at, on_shelf_at, on_shelf_at + interval '90 days',
              on_shelf_at - interval '3 days', on_shelf_at
       FROM titled JOIN sellers ON sellers.n = titled.seller_n`,
      [
        OFFER_DRAW,
        FIBRE_DRAW,
        VALUE_DRAW,
        FAMILY_DRAW,
        KIND_DRAW,
        CUT_KINDS,
        CUT_KINDS.map((kind) => KIND_WORDS[kind]),
        FIBRES.map((fibre) => FIBRE_WORDS[fibre]),
        EMAIL_DOMAIN,
        SHELF_BUNDLES,
        SHELF_SELLERS,
        JSON.stringify(VALUE_WORDS),
        JSON.stringify(FAMILY_WORDS),
        PROJECTS,
        FIBRES,
        USES,
      ],
    );
    await client.query(
      `INSERT INTO bundle_photos (bundle_id, position, display_key, medium_key, thumb_key, content_type, width, height, average_hex)
       SELECT b.id, 0, $1, $1, $2, 'image/webp', $3, $4, $5
       FROM bundles b JOIN members m ON m.id = b.seller_id
       WHERE m.email LIKE '%@' || $6::text`,
      [DISPLAY_KEY, THUMB_KEY, photo.width, photo.height, photo.averageHex, EMAIL_DOMAIN],
    );
    for (const trigger of BUNDLE_TALLY_TRIGGERS) await client.query(`ALTER TABLE bundles ENABLE TRIGGER ${trigger}`);
    await client.query('DELETE FROM office_tallies');
    await client.query('INSERT INTO office_tallies (grain, day, figure, key, amount, compacted) SELECT *, true FROM office_tallies_expected()');
    await client.query('COMMIT');
    await client.query('VACUUM (ANALYZE) members, bundles, bundle_photos, office_tallies');
    return { loaded: true, seconds: (Date.now() - started) / 1000, bundlesOnShelf: await count() };
  } catch (error) {
    await client.query('ROLLBACK').catch(() => undefined);
    throw error;
  } finally {
    await client.end();
  }
}
