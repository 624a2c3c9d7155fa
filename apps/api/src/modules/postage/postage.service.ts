import { DEFAULT_POSTAGE_TABLE, quotePostage, type PostageItem, type PostageQuote, type PostageTable, type UnitSystem } from '@scrap-relay/shared';
import type { Guild } from '../../db/models/index.ts';
import { unprocessable } from '../../errors/index.ts';
import { loadGuild } from '../guild/guild.service.ts';

export const postageTableOf = (guild: Guild): PostageTable => guild.postageTable ?? DEFAULT_POSTAGE_TABLE;

/**
 * Runs the guild's postage rules; a bundle too heavy to post, a weight with no rate or a country the table
 * does not cover is a 422 the buyer can act on. `field` names the destination in the request (`address`, `destination`).
 */
export function quoteOrThrow(
  guild: Guild,
  items: PostageItem[],
  to: { postalCode: string; country: string },
  field: string,
  units: UnitSystem,
): PostageQuote {
  const result = quotePostage({ table: postageTableOf(guild), items, postalCode: to.postalCode, country: to.country, currency: guild.currency, units });
  if (!result.ok) {
    // The domain's messages already say what to do instead (a meeting handover, or asking the seller).
    const at = result.error.code === 'country_not_covered' ? `${field}.country` : 'items';
    throw unprocessable(result.error.message, { [at]: result.error.message });
  }
  return result.quote;
}

export async function savePostageTable(table: PostageTable): Promise<PostageTable> {
  const guild = await loadGuild();
  await guild.update({ postageTable: table });
  return postageTableOf(guild);
}
