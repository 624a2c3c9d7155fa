import { randomUUID } from 'node:crypto';
import { DatabaseError, QueryTypes, type Sequelize } from 'sequelize';
import type { ShelfQuery } from '@scrap-relay/shared';
import type { AppContext } from '../../context.ts';
import type { FileStorage } from '../../integrations/storage.ts';
import { runNamedStatement } from '../../db/named-statement.ts';
import { SHELF_RUN, searchShelf, type ShelfPageRead } from './shelf.query.ts';

/**
 * Pages of the shelf kept in PostgreSQL (migration `20261206010000-shelf-pages.ts`): a page many members ask
 * for is worked out once and then read back as it was written, by every API process, until something on the
 * shelf changes. A kept page is served only while no change to the shelf has committed that its snapshot did
 * not see, so a member never gets an older page than working it out afresh would give.
 *
 * Kept at most this long, so pages nobody asks for again do not pile up (the prune job clears them).
 */
export const SHELF_PAGE_KEPT = '10 minutes';

export interface ShelfPageBody {
  /** The page's JSON, as the route sends it. */
  body: string;
  /** Express's own ETag of the body, kept with it, so a browser asking again with it gets a 304 (none when the app sends none). */
  etag: string | null;
}

/**
 * Which code made a page: the production build's own id (`build.ts` writes one into each build), or, run from
 * source, this process's. A page made by another version of the code is another page, so a deploy that changes
 * what a card holds never serves the old shape, and two versions running side by side keep their own pages.
 */
const CODE_VERSION = process.env.SR_BUILD_ID ?? randomUUID();

/** The key of a page: the code and photo address that made it, and the parsed query (fields in the schema's order). */
export const shelfPageKey = (query: ShelfQuery, storage: Pick<FileStorage, 'publicUrl'>) =>
  JSON.stringify({ code: CODE_VERSION, photos: storage.publicUrl(''), query });

// Current: read on this run of the database, not too old, and no change committed since that its snapshot missed.
const KEPT_PAGE = {
  name: 'shelf-page-kept',
  text: `SELECT p.body, p.etag FROM shelf_pages p
         WHERE p.key = $1 AND p.run = (${SHELF_RUN}) AND p.made_at > now() - interval '${SHELF_PAGE_KEPT}'
           AND NOT EXISTS (
             SELECT 1 FROM shelf_changes c
             WHERE c.xid >= pg_snapshot_xmin(p.snapshot) AND NOT pg_visible_in_snapshot(c.xid, p.snapshot))`,
};

// Kept only when read on this run of the database in a snapshot at or above the floor, and never over a page
// read later on the same run.
const KEEP_PAGE = {
  name: 'shelf-page-keep',
  text: `INSERT INTO shelf_pages (key, snapshot, run, made_at, etag, body)
         SELECT $1, $2::pg_snapshot, $3, $4, $5, $6
         WHERE $3 = (${SHELF_RUN}) AND pg_snapshot_xmin($2::pg_snapshot) >= (SELECT xid FROM shelf_pages_floor)
         ON CONFLICT (key) DO UPDATE
           SET snapshot = excluded.snapshot, run = excluded.run, made_at = excluded.made_at, etag = excluded.etag, body = excluded.body
         WHERE shelf_pages.run <> excluded.run OR pg_snapshot_xmax(shelf_pages.snapshot) <= pg_snapshot_xmax(excluded.snapshot)`,
};

/** A new mark for the run, when a crash took the last one: pages read before it are never kept or served. */
const MARK_RUN = { name: 'shelf-run-mark', text: 'INSERT INTO shelf_run DEFAULT VALUES ON CONFLICT DO NOTHING' };

/**
 * The page of the shelf for a query: the kept copy when it is current, otherwise worked out and kept (or only
 * worked out, when the guild's configuration turns kept pages off). `etagOf` is the app's ETag function
 * (`app.get('etag fn')`), so a kept page carries the ETag Express would give it.
 */
export async function shelfPageBody(
  ctx: Pick<AppContext, 'sequelize' | 'storage' | 'config'>,
  query: ShelfQuery,
  etagOf: (body: string) => string | undefined,
): Promise<ShelfPageBody> {
  const { sequelize, storage, config } = ctx;
  const key = shelfPageKey(query, storage);
  if (config.shelfPagesKept) {
    const [kept] = await runNamedStatement<ShelfPageBody>(sequelize, { ...KEPT_PAGE, values: [key] });
    if (kept) return kept;
  }
  const { page, read } = await searchShelf(sequelize, storage, query);
  const body = JSON.stringify(page);
  const made = { body, etag: etagOf(body) ?? null };
  if (config.shelfPagesKept && read.run === null) await runNamedStatement(sequelize, { ...MARK_RUN, values: [] });
  else if (config.shelfPagesKept) await keepShelfPage(sequelize, key, read, made);
  return made;
}

/** Keeps a page read as `read` says, unless the run's mark has changed, the floor has passed it or a later page is kept. */
export async function keepShelfPage(sequelize: Sequelize, key: string, read: ShelfPageRead['read'], page: ShelfPageBody) {
  const values = [key, read.snapshot, read.run, read.madeAt, page.etag, page.body];
  await runNamedStatement(sequelize, { ...KEEP_PAGE, values });
}

/**
 * Clears pages kept longer than SHELF_PAGE_KEPT or read on an earlier run of the database, and the changes no kept
 * page needs any more (and any from another database's ids, as a restored dump could bring: ids not yet handed out
 * here would make every page look out of date). The table lock holds new pages back while the floor moves (reads go on), so a page made in
 * an older snapshot is refused by the floor rather than kept without the changes it did not see. The lock is
 * waited for a second at most (say, behind autovacuum), since pages being kept wait behind the waiting prune;
 * the next run tries again. Returns the number of pages cleared.
 */
export async function pruneShelfPages(sequelize: Sequelize): Promise<number> {
  try {
    return await sequelize.transaction(async (transaction) => {
      await sequelize.query(`SET LOCAL lock_timeout = '1s'`, { transaction });
      await sequelize.query('LOCK TABLE shelf_pages IN SHARE ROW EXCLUSIVE MODE', { transaction });
      const cleared = await sequelize.query(
        `DELETE FROM shelf_pages
         WHERE made_at <= now() - interval '${SHELF_PAGE_KEPT}' OR run IS DISTINCT FROM (${SHELF_RUN})
         RETURNING 1`,
        { type: QueryTypes.SELECT, transaction },
      );
      await sequelize.query(
        `UPDATE shelf_pages_floor SET xid = LEAST((SELECT min(pg_snapshot_xmin(snapshot)) FROM shelf_pages), pg_snapshot_xmin(pg_current_snapshot()))`,
        { transaction },
      );
      await sequelize.query(
        'DELETE FROM shelf_changes WHERE xid < (SELECT xid FROM shelf_pages_floor) OR xid >= pg_snapshot_xmax(pg_current_snapshot())',
        { transaction },
      );
      return cleared.length;
    });
  } catch (error) {
    if (error instanceof DatabaseError && (error.parent as { code?: string }).code === LOCK_NOT_AVAILABLE) return 0;
    throw error;
  }
}

/** PostgreSQL's error code when lock_timeout ends a wait for a lock. */
const LOCK_NOT_AVAILABLE = '55P03';
