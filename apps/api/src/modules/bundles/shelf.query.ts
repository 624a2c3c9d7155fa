import { createHash } from 'node:crypto';
import type { Sequelize } from 'sequelize';
import type { CutKind, Fibre, Offer, ShelfPage, ShelfQuery, ColourFamily, ColourValue } from '@scrap-relay/shared';
import { estimateYield } from '@scrap-relay/shared';
import type { FileStorage } from '../../integrations/storage.ts';
import { runNamedStatement, type NamedStatement } from '../../db/named-statement.ts';

const ORDER_BY: Record<ShelfQuery['sort'], string> = {
  newest: 'b.on_shelf_at DESC, b.id DESC',
  price_asc: 'b.price_minor ASC NULLS FIRST, b.id ASC',
  price_desc: 'b.price_minor DESC NULLS LAST, b.id DESC',
  weight_asc: 'b.weight_grams ASC, b.id ASC',
  weight_desc: 'b.weight_grams DESC, b.id DESC',
};

interface ShelfRow {
  id: string;
  title: string;
  offer: Offer;
  price_minor: number | null;
  currency: string;
  meeting_handover_ok: boolean;
  quantity_available: number;
  weight_grams: number;
  fibre: Fibre;
  cut_kinds: CutKind[];
  colour_value: ColourValue | null;
  colour_family: ColourFamily | null;
  on_shelf_at: Date;
  thumb_key: string | null;
  medium_key: string | null;
}

/** Builds the WHERE clause from the filters; every value goes in as a bind parameter. */
function whereClause(q: ShelfQuery): { sql: string; bind: unknown[] } {
  const conditions = [`b.state = 'on_shelf'`, `b.offer <> 'starter'`];
  const bind: unknown[] = [];
  const add = (sql: (n: string) => string, value: unknown) => {
    bind.push(value);
    conditions.push(sql(`$${bind.length}`));
  };
  if (q.offer) add((p) => `b.offer = ${p}`, q.offer);
  if (q.cut) add((p) => `b.cut_kinds @> ARRAY[${p}]::text[]`, q.cut);
  if (q.size) add((p) => `b.cut_sizes @> ARRAY[${p}]::text[]`, q.size);
  if (q.value) add((p) => `b.colour_value = ${p}`, q.value);
  if (q.family) add((p) => `b.colour_family = ${p}`, q.family);
  if (q.fibre) add((p) => `b.fibre = ${p}`, q.fibre);
  if (q.minGrams !== undefined) add((p) => `b.weight_grams >= ${p}`, q.minGrams);
  if (q.maxGrams !== undefined) add((p) => `b.weight_grams <= ${p}`, q.maxGrams);
  // Free bundles cost nothing, so they are under any price limit.
  if (q.maxPriceMinor !== undefined) add((p) => `(b.price_minor IS NULL OR b.price_minor <= ${p})`, q.maxPriceMinor);
  if (q.q) add((p) => `b.search @@ websearch_to_tsquery('english', ${p})`, q.q);
  return { sql: conditions.join(' AND '), bind };
}

export const SHELF_COUNT_CAP = 1000;

/** The mark of this run of the database (migration `20261206010000-shelf-pages.ts`); null while it is missing. */
export const SHELF_RUN = `SELECT id::text || '/' || xmin::text FROM shelf_run`;

/** A text search counts the page asked for and this many pages after it. */
export const TEXT_SEARCH_PAGES_AHEAD = 4;

/**
 * Where the count of matches stops. Filters alone count to 1,000 from an index. A text search has to
 * read each candidate bundle's words: for a common word among 100,000 bundles the statement took 4.7 ms
 * counting to 1,001 and 1.4 ms counting to 121 (pgbench, docs/PERFORMANCE.md). It counts four pages past
 * the page asked for, enough for the pager to offer the next pages and to say "more than 120".
 */
export function shelfCountCap(q: Pick<ShelfQuery, 'q' | 'page' | 'pageSize'>): number {
  return q.q ? Math.min(SHELF_COUNT_CAP, (q.page + TEXT_SEARCH_PAGES_AHEAD) * q.pageSize) : SHELF_COUNT_CAP;
}

/**
 * The one statement behind a page of the shelf: the capped count, the page, and each page bundle's
 * first photo, in one round trip. The photo is looked up only for the rows of the page, never for
 * the rows an OFFSET skips. Counting stops at the cap (`shelfCountCap`): past it the shelf says
 * "more than 1,000" (a text search's first page, "more than 120"), and offers a next page as long
 * as pages come back full.
 *
 * Its text depends only on which filters are set, on the sort and on whether it is the first page,
 * so it is named after its text and prepared once per connection (a few dozen shapes in practice,
 * out of 512 filter sets × 5 sorts × 2); every value, the page size and offset included, is a
 * bind parameter. A text search stays unnamed: how many bundles a word matches decides the plan,
 * and a generic plan, made without the words, counted matches 10 to 50 times slower in the
 * benchmark.
 */
export function shelfStatement(q: ShelfQuery): NamedStatement {
  const where = whereClause(q);
  const limit = `$${where.bind.length + 1}`;
  const offset = `$${where.bind.length + 2}`;
  // A text search's cap depends on the page, so it is a bind parameter; prepared statements keep 1,001.
  const countLimit = q.q ? `$${where.bind.length + 3}` : String(SHELF_COUNT_CAP + 1);
  const columns = `b.id, b.title, b.offer, b.price_minor, b.currency, b.meeting_handover_ok, b.quantity_available, b.weight_grams,
              b.fibre, b.cut_kinds, b.colour_value, b.colour_family, b.on_shelf_at`;
  const ordered = `WHERE ${where.sql} ORDER BY ${ORDER_BY[q.sort]} LIMIT ${limit} OFFSET ${offset}`;
  // Past the first page, the page's ids come first and then its rows: where an index holds every
  // column the filters and the sort need, the rows an OFFSET skips are never read from the table.
  const page =
    q.page === 1
      ? `page AS (SELECT ${columns} FROM bundles b ${ordered})`
      : `page_ids AS (SELECT b.id FROM bundles b ${ordered}),
     page AS (SELECT ${columns} FROM page_ids JOIN bundles b ON b.id = page_ids.id)`;
  // The snapshot the statement reads in, the run's mark and the moment: a page kept for later is current only
  // while no change has committed that this snapshot did not see (shelf-pages.ts).
  const text = `WITH counted AS (
       SELECT count(*)::int AS total, pg_current_snapshot()::text AS snapshot, (${SHELF_RUN}) AS run, statement_timestamp() AS made_at FROM (SELECT 1 FROM bundles b WHERE ${where.sql} LIMIT ${countLimit}) capped
     ), ${page}
     SELECT counted.total, counted.snapshot, counted.run, counted.made_at, b.*, photo.thumb_key, photo.medium_key
     FROM counted
     LEFT JOIN page b ON true
     LEFT JOIN LATERAL (
       SELECT p.thumb_key, p.medium_key FROM bundle_photos p WHERE p.bundle_id = b.id ORDER BY p.position LIMIT 1
     ) photo ON true
     ORDER BY ${ORDER_BY[q.sort]}`;
  const name = q.q ? undefined : `shelf-${createHash('sha1').update(text).digest('hex').slice(0, 20)}`;
  const values = [...where.bind, q.pageSize, (q.page - 1) * q.pageSize];
  return { name, text, values: q.q ? [...values, shelfCountCap(q) + 1] : values };
}

/** A page of the shelf with the snapshot it was read in (`pg_snapshot` text), the run's mark and the moment. */
export interface ShelfPageRead {
  page: ShelfPage;
  /** `run` is null when the run's mark is missing (after a crash, until the next page lays one). */
  read: { snapshot: string; run: string | null; madeAt: Date };
}

export async function searchShelf(sequelize: Sequelize, storage: FileStorage, q: ShelfQuery): Promise<ShelfPageRead> {
  type Row = ShelfRow & { total: number; snapshot: string; run: string | null; made_at: Date };
  const rows = await runNamedStatement<Row>(sequelize, shelfStatement(q));
  // The count's row is always there, with or without a bundle on it.
  const { total, snapshot, run, made_at: madeAt } = rows[0]!;
  const cap = shelfCountCap(q);
  // With no bundle on the page, the count still comes back, on one row without a bundle.
  const bundles = rows.filter((r) => r.id !== null);
  const page: ShelfPage = {
    items: bundles.map((r) => ({
      id: r.id,
      title: r.title,
      offer: r.offer,
      priceMinor: r.price_minor,
      currency: r.currency,
      meetingHandoverOk: r.meeting_handover_ok,
      quantityAvailable: r.quantity_available,
      weightGrams: r.weight_grams,
      fibre: r.fibre,
      cutKinds: r.cut_kinds,
      colour: { value: r.colour_value, family: r.colour_family },
      thumbUrl: r.thumb_key ? storage.publicUrl(r.thumb_key) : null,
      thumb2xUrl: r.medium_key ? storage.publicUrl(r.medium_key) : null,
      yield: estimateYield({ grams: r.weight_grams, fibre: r.fibre }),
      onShelfAt: new Date(r.on_shelf_at).toISOString(),
    })),
    page: q.page,
    pageSize: q.pageSize,
    total: Math.min(total, cap),
    totalCapped: total > cap,
  };
  return { page, read: { snapshot, run, madeAt } };
}
