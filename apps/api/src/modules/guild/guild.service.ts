import { randomInt } from 'node:crypto';
import type { GuildSettings } from '@scrap-relay/shared';
import type { InferCreationAttributes } from 'sequelize';
import { modelColumns } from '../../db/model-columns.ts';
import { Guild } from '../../db/models/index.ts';
import { runNamedStatement, type NamedStatement } from '../../db/named-statement.ts';
import { AppError, unprocessable } from '../../errors/index.ts';

const CODE_ALPHABET = 'ABCDEFGHJKLMNPQRSTUVWXYZ23456789';

/** Invite codes people can read aloud at a meeting: no 0/O or 1/I. */
export function newInviteCode(): string {
  const part = () => Array.from({ length: 4 }, () => CODE_ALPHABET[randomInt(CODE_ALPHABET.length)]).join('');
  return `${part()}-${part()}`;
}

let guildStatement: NamedStatement | undefined;

/** The guild, read on most requests (every GET /api/session among them), by a statement prepared once per connection. */
export async function loadGuild(): Promise<Guild> {
  guildStatement ??= { name: 'guild', text: `SELECT ${modelColumns(Guild)} FROM guild WHERE id = 1`, values: [] };
  const [row] = await runNamedStatement<InferCreationAttributes<Guild>>(Guild.sequelize!, guildStatement);
  if (!row) throw new AppError(503, 'service_unavailable', 'The guild has not been set up yet: run the migrations and the set-up.');
  return Guild.build(row, { isNewRecord: false, raw: true });
}

export function settingsOf(guild: Guild): GuildSettings {
  return {
    name: guild.name,
    town: guild.town,
    currency: guild.currency as GuildSettings['currency'],
    defaultUnits: guild.defaultUnits,
    ...guild.settings,
    timeZone: guildTimeZone(guild),
  };
}

/** The zone e-mails give times in; UTC for a guild that has not chosen one. */
export function guildTimeZone(guild: Guild): string {
  return guild.settings.timeZone ?? 'UTC';
}

/**
 * Saves the guild's settings. The currency can change only while no listing, order or ledger entry holds an
 * amount: prices are whole minor units of the currency they were entered in, so 1500 cents must not become 1500 yen.
 */
export async function updateSettings(input: GuildSettings): Promise<GuildSettings> {
  const { name, town, currency, defaultUnits, ...settings } = input;
  return Guild.sequelize!.transaction(async (transaction) => {
    const guild = (await Guild.findByPk(1, { transaction, lock: transaction.LOCK.UPDATE }))!;
    if (currency !== guild.currency) {
      const [[{ amounts }]] = (await Guild.sequelize!.query(
        `SELECT EXISTS (SELECT 1 FROM bundles WHERE price_minor IS NOT NULL)
             OR EXISTS (SELECT 1 FROM orders) OR EXISTS (SELECT 1 FROM ledger_entries) AS amounts`,
        { transaction },
      )) as unknown as [[{ amounts: boolean }]];
      if (amounts) {
        throw new AppError(409, 'conflict', `The currency stays ${guild.currency}: listings, orders or the ledger already hold amounts in it.`, {
          currency: `Prices and the ledger are kept in ${guild.currency}; it can change only before any are entered.`,
        });
      }
    }
    const zoneChanged = (settings.timeZone ?? 'UTC') !== guildTimeZone(guild);
    if (zoneChanged) {
      // The office's days are read by PostgreSQL: a zone its time zone data lacks would stop every write being tallied.
      const [[{ known }]] = (await Guild.sequelize!.query(`SELECT EXISTS (SELECT 1 FROM pg_timezone_names WHERE name = $1) AS known`, {
        bind: [settings.timeZone ?? 'UTC'],
        transaction,
      })) as unknown as [[{ known: boolean }]];
      if (!known) {
        throw unprocessable(`The database does not know the time zone ${settings.timeZone}.`, { timeZone: 'Choose another time zone from the list.' });
      }
    }
    // A new zone rebuilds the office's tallies in this same transaction (the guild's trigger, migration
    // 20261204040000), so no figure ever mixes two zones.
    await guild.update({ name, town, currency, defaultUnits, settings }, { transaction });
    return settingsOf(guild);
  });
}

export async function rotateInviteCode(): Promise<string> {
  const guild = await loadGuild();
  await guild.update({ inviteCode: newInviteCode(), inviteCodeRotatedAt: new Date() });
  return guild.inviteCode;
}

export const inviteCodeMatches = (guild: Guild, given: string) =>
  guild.inviteCode.replace(/\s+/g, '').toUpperCase() === given.replace(/\s+/g, '').toUpperCase();
