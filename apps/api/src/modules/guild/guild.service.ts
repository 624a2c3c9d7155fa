import { randomInt } from 'node:crypto';
import type { GuildSettings } from '@scrap-relay/shared';
import type { InferCreationAttributes } from 'sequelize';
import { modelColumns } from '../../db/model-columns.ts';
import { Guild } from '../../db/models/index.ts';
import { runNamedStatement, type NamedStatement } from '../../db/named-statement.ts';
import { AppError } from '../../errors/index.ts';

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
  return { name: guild.name, town: guild.town, currency: guild.currency as GuildSettings['currency'], defaultUnits: guild.defaultUnits, ...guild.settings };
}

export async function updateSettings(input: GuildSettings): Promise<GuildSettings> {
  const guild = await loadGuild();
  const { name, town, currency, defaultUnits, ...settings } = input;
  await guild.update({ name, town, currency, defaultUnits, settings });
  return settingsOf(guild);
}

export async function rotateInviteCode(): Promise<string> {
  const guild = await loadGuild();
  await guild.update({ inviteCode: newInviteCode(), inviteCodeRotatedAt: new Date() });
  return guild.inviteCode;
}

export const inviteCodeMatches = (guild: Guild, given: string) =>
  guild.inviteCode.replace(/\s+/g, '').toUpperCase() === given.replace(/\s+/g, '').toUpperCase();
