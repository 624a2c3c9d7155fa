// @vitest-environment happy-dom
import { QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import { act } from 'react';
import { afterEach, describe, expect, it } from 'vitest';
import { sessionQueryKey } from '../features/auth/api/get-session.ts';
import { createQueryClient } from '../lib/react-query.ts';
import { makeSession, makeUser, testGuild } from '../testing/fixtures.ts';
import { cleanup, render, waitFor } from '../testing/render.tsx';
import { SESSION_CACHE_KEY, useGuildPostageCountries, useGuildTimeZone } from './guild-session.ts';

afterEach(() => cleanup());

function GuildFacts() {
  return (
    <p>
      {useGuildTimeZone()} | {useGuildPostageCountries().join(',')}
    </p>
  );
}

async function show(client: QueryClient) {
  return render(
    <QueryClientProvider client={client}>
      <GuildFacts />
    </QueryClientProvider>,
  );
}

describe('the guild’s facts from the session', () => {
  it('reads the same cache entry the auth feature keeps the session in', () => {
    expect(SESSION_CACHE_KEY).toEqual(sessionQueryKey);
  });

  it('gives the guild’s time zone and postage countries, and follows a refreshed session', async () => {
    const client = createQueryClient();
    client.setQueryData(sessionQueryKey, { ...makeSession(makeUser()), guild: { ...testGuild, timeZone: 'America/Los_Angeles', postageCountries: ['US'] } });
    const { container } = await show(client);
    expect(container.textContent).toBe('America/Los_Angeles | US');

    await act(async () => {
      client.setQueryData(sessionQueryKey, { ...makeSession(makeUser()), guild: { ...testGuild, timeZone: 'Europe/London', postageCountries: ['GB', 'IE'] } });
    });
    await waitFor(() => expect(container.textContent).toBe('Europe/London | GB,IE'));
  });

  it('falls back to UTC and any country, as the API does, without asking the API itself', async () => {
    const client = createQueryClient();
    const { container } = await show(client);
    expect(container.textContent).toBe('UTC | ');
    expect(client.getQueryState(sessionQueryKey)?.fetchStatus ?? 'idle').toBe('idle');
  });

  it('does not trust a zone Intl does not know', async () => {
    const client = createQueryClient();
    client.setQueryData(sessionQueryKey, { ...makeSession(makeUser()), guild: { ...testGuild, timeZone: 'Ferncombe/Village_Hall', postageCountries: [] } });
    const { container } = await show(client);
    expect(container.textContent).toBe('UTC | ');
  });
});
