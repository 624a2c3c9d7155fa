import { describeShelfFilters, type ShelfFilters, type WishInput } from '@scrap-relay/shared';
import { Wish, type Member } from '../../db/models/index.ts';
import { badRequest, conflict, notFound } from '../../errors/index.ts';
import { loadGuild } from '../guild/guild.service.ts';

export const MAX_WISHES_PER_MEMBER = 20;

/** One member to tell about a bundle, with every wish of theirs it matches, by name. */
export interface WishMatch {
  member_name: string;
  member_email: string;
  wish_names: string[];
}

/**
 * Records a notification for every wish the bundle ($1) matches and returns the ones not
 * notified before, one row per member, so each wish hears about a bundle once and each
 * member gets one e-mail however many of their wishes match. Filters mirror the shelf's.
 */
export const WISH_MATCH_SQL = `
  WITH matched AS (
    INSERT INTO wish_notifications (wish_id, bundle_id)
    SELECT w.id, b.id
    FROM wishes w
    JOIN bundles b ON b.id = $1
    JOIN members m ON m.id = w.member_id AND m.active AND m.email_verified_at IS NOT NULL
    WHERE w.member_id <> b.seller_id AND b.offer <> 'starter'
      AND (w.filters->>'offer' IS NULL OR w.filters->>'offer' = b.offer)
      AND (w.filters->>'cut' IS NULL OR b.cut_kinds @> ARRAY[w.filters->>'cut'])
      AND (w.filters->>'size' IS NULL OR b.cut_sizes @> ARRAY[w.filters->>'size'])
      AND (w.filters->>'value' IS NULL OR w.filters->>'value' = b.colour_value)
      AND (w.filters->>'family' IS NULL OR w.filters->>'family' = b.colour_family)
      AND (w.filters->>'fibre' IS NULL OR w.filters->>'fibre' = b.fibre)
      AND (w.filters->>'minGrams' IS NULL OR b.weight_grams >= (w.filters->>'minGrams')::int)
      AND (w.filters->>'maxGrams' IS NULL OR b.weight_grams <= (w.filters->>'maxGrams')::int)
      AND (w.filters->>'maxPriceMinor' IS NULL OR coalesce(b.price_minor, 0) <= (w.filters->>'maxPriceMinor')::int)
      AND (coalesce(w.filters->>'q', '') = '' OR b.search @@ websearch_to_tsquery('english', w.filters->>'q'))
    ON CONFLICT DO NOTHING
    RETURNING wish_id
  )
  SELECT m.name AS member_name, m.email AS member_email, array_agg(w.name ORDER BY w.name, w.id) AS wish_names
  FROM matched JOIN wishes w ON w.id = matched.wish_id JOIN members m ON m.id = w.member_id
  GROUP BY m.id, m.name, m.email`;

export async function listWishes(member: Member): Promise<Wish[]> {
  return Wish.findAll({ where: { memberId: member.id }, order: [['createdAt', 'DESC']] });
}

type StoredFilters = Record<string, string | number>;

/** The filters in a fixed order with their values as text, so two wishes asking for the same bundles compare equal. */
function filtersKey(filters: Record<string, unknown>): string {
  const entries = Object.entries(filters)
    .filter(([, v]) => v !== undefined && v !== null && v !== '')
    .map(([k, v]) => [k, String(v)] as const)
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  return JSON.stringify(entries);
}

export async function addWish(member: Member, input: WishInput): Promise<Wish> {
  const existing = await Wish.findAll({ where: { memberId: member.id }, attributes: ['id', 'name', 'filters'] });
  if (existing.length >= MAX_WISHES_PER_MEMBER) throw badRequest(`You can keep up to ${MAX_WISHES_PER_MEMBER} wishes; delete one first.`, { name: 'Too many wishes.' });
  const filters = Object.fromEntries(Object.entries(input.filters).filter(([, v]) => v !== undefined && v !== '')) as StoredFilters;
  // The same filters twice would only send the same e-mail twice over.
  const twin = existing.find((wish) => filtersKey(wish.filters as StoredFilters) === filtersKey(filters));
  if (twin) {
    const guild = await loadGuild();
    const words = describeShelfFilters(filters as ShelfFilters, { units: member.units ?? guild.defaultUnits, currency: guild.currency });
    throw conflict(`You already have a wish for these filters (${words}): “${twin.name}”.`, { filters: `Already saved as your wish “${twin.name}”.` });
  }
  return Wish.create({ memberId: member.id, name: input.name, filters });
}

export async function removeWish(member: Member, id: string): Promise<void> {
  const removed = await Wish.destroy({ where: { id, memberId: member.id } });
  if (removed === 0) throw notFound('That wish');
}
