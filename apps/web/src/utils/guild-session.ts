import { useQuery } from '@tanstack/react-query';
import { canShowTimeZone, type GuildSummary, type SessionResponse } from '@scrap-relay/shared';
import { api } from '../lib/api-client.ts';

/**
 * The guild facts every screen may need (its time zone, the countries it posts to), read from the session the
 * app has already loaded. The session query belongs to the auth feature, which shared code may not import, so
 * the cache key is defined here and the auth feature uses it. The observer is passive (`enabled: false`):
 * it never asks the API itself, it only follows the cached session as the auth feature reads and refreshes it.
 */
export const SESSION_CACHE_KEY = ['session'] as const;

export function useGuildSummary(): GuildSummary | undefined {
  return useQuery<SessionResponse, Error, GuildSummary>({
    queryKey: SESSION_CACHE_KEY,
    // The same request as the auth feature's, named only so the query is complete; this observer never runs it.
    queryFn: ({ signal }) => api.getSession({ signal }),
    enabled: false,
    select: selectGuild,
  }).data;
}

const selectGuild = (session: SessionResponse): GuildSummary => session.guild;

/** The signed-in member's id from the cached session, or null when nobody is signed in (or it has not loaded). */
export function useSignedInMemberId(): string | null {
  return (
    useQuery<SessionResponse, Error, string | null>({
      queryKey: SESSION_CACHE_KEY,
      queryFn: ({ signal }) => api.getSession({ signal }),
      enabled: false,
      select: selectMemberId,
    }).data ?? null
  );
}

const selectMemberId = (session: SessionResponse): string | null => session.user?.id ?? null;

/** The guild's IANA time zone (its meetings' and e-mails' zone); UTC until the session says otherwise, as the API does. */
export function useGuildTimeZone(): string {
  const zone = useGuildSummary()?.timeZone;
  return zone && canShowTimeZone(zone) ? zone : 'UTC';
}

/** Two-letter codes of the countries the guild's postage table covers; empty when it quotes any address. */
export function useGuildPostageCountries(): readonly string[] {
  return useGuildSummary()?.postageCountries ?? NO_COUNTRIES;
}

const NO_COUNTRIES: readonly string[] = [];
