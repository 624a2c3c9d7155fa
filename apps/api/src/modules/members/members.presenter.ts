import { isNewQuilter, type GuildSummary, type MemberRow, type SessionUser } from '@scrap-relay/shared';
import type { Guild, Member } from '../../db/models/index.ts';
import { abilitiesFor, can, type Actor } from '../../policies/index.ts';
import { guildTimeZone } from '../guild/guild.service.ts';
import { postageTableOf } from '../postage/postage.service.ts';

export function newQuilterStatus(member: Member, guild: Guild, now: Date): boolean {
  return isNewQuilter({
    joinedAt: member.joinedAt,
    newQuilterFlag: member.newQuilterFlag,
    newcomerWindowMonths: guild.settings.newcomerWindowMonths,
    now,
  });
}

export function presentGuildSummary(guild: Guild): GuildSummary {
  return {
    name: guild.name,
    town: guild.town,
    currency: guild.currency,
    defaultUnits: guild.defaultUnits,
    // Every member's screens need these (meeting times, the country of an address), not only the admins who may read the settings.
    timeZone: guildTimeZone(guild),
    postageCountries: [...(postageTableOf(guild).countries ?? [])],
  };
}

export function presentSessionUser(member: Member, guild: Guild, now: Date): SessionUser {
  const newQuilter = newQuilterStatus(member, guild, now);
  return {
    id: member.id,
    name: member.name,
    email: member.email,
    roles: member.roles,
    newQuilter,
    emailVerified: member.emailVerifiedAt !== null,
    units: member.units ?? guild.defaultUnits,
    abilities: abilitiesFor({ ...actorOf(member), newQuilter }),
  };
}

export function presentMemberRow(member: Member, viewer: Actor, guild: Guild, now: Date): MemberRow {
  return {
    id: member.id,
    name: member.name,
    email: member.email,
    roles: member.roles,
    newQuilter: newQuilterStatus(member, guild, now),
    newQuilterFlag: member.newQuilterFlag,
    emailVerified: member.emailVerifiedAt !== null,
    active: member.active,
    joinedAt: member.joinedAt.toISOString(),
    abilities: {
      changeRoles: can(viewer, 'member.changeRoles', member),
      deactivate: can(viewer, 'member.deactivate', member),
      flagNewQuilter: can(viewer, 'member.flagNewQuilter', member),
    },
  };
}

export const actorOf = (m: Member): Actor => ({ id: m.id, roles: m.roles, active: m.active, emailVerifiedAt: m.emailVerifiedAt });
