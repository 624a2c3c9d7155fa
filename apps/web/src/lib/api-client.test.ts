// @vitest-environment happy-dom
import { describe, expect, it, vi } from 'vitest';
import { jsonResponse, makeSession, makeUser } from '../testing/fixtures.ts';
import { ApiError, createApiClient } from './api-client.ts';

interface Call {
  method: string;
  url: string;
  csrf: string | null;
  body: unknown;
}

/** A fetch double that answers from a script and records what the client sent. */
function scriptedFetch(answers: Array<(call: Call) => Response | Promise<Response>>) {
  const calls: Call[] = [];
  const fetch = vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
    const headers = new Headers(init?.headers);
    const call: Call = {
      method: init?.method ?? 'GET',
      url: String(input),
      csrf: headers.get('X-CSRF-Token'),
      body: typeof init?.body === 'string' ? JSON.parse(init.body) : undefined,
    };
    calls.push(call);
    const answer = answers.shift();
    if (!answer) throw new Error(`Unexpected request ${call.method} ${call.url}`);
    return answer(call);
  });
  return { fetch: fetch as unknown as typeof globalThis.fetch, calls };
}

describe('api client: CSRF', () => {
  it('reads the session for a token before its first write and sends it in X-CSRF-Token', async () => {
    const { fetch, calls } = scriptedFetch([() => jsonResponse(200, makeSession(null, 'token-a')), () => jsonResponse(201, { ok: true })]);
    const api = createApiClient({ fetch });

    await expect(api.post('/members', { name: 'Hester' })).resolves.toEqual({ ok: true });

    expect(calls.map((c) => `${c.method} ${c.url}`)).toEqual(['GET /api/session', 'POST /api/members']);
    expect(calls[1]).toMatchObject({ csrf: 'token-a', body: { name: 'Hester' } });
  });

  it('after csrf_invalid re-reads the session, retries once with the new token and tells listeners', async () => {
    const refreshed = makeSession(makeUser(), 'token-b');
    const { fetch, calls } = scriptedFetch([
      () => jsonResponse(200, makeSession(null, 'token-a')),
      () => jsonResponse(403, { error: { code: 'csrf_invalid', message: 'Reload and try again.' } }),
      () => jsonResponse(200, refreshed),
      () => jsonResponse(200, { saved: true }),
    ]);
    const api = createApiClient({ fetch });
    const listener = vi.fn();
    api.onSessionRefreshed(listener);
    await api.getSession();

    await expect(api.patch('/members/m-1', { active: false })).resolves.toEqual({ saved: true });

    expect(calls.map((c) => `${c.method} ${c.url} ${c.csrf ?? '-'}`)).toEqual([
      'GET /api/session -',
      'PATCH /api/members/m-1 token-a',
      'GET /api/session -',
      'PATCH /api/members/m-1 token-b',
    ]);
    expect(listener).toHaveBeenCalledWith(refreshed);
  });

  it('gives up after one retry: a second csrf_invalid reaches the caller', async () => {
    const refusal = () => jsonResponse(403, { error: { code: 'csrf_invalid', message: 'Reload and try again.' } });
    const { fetch, calls } = scriptedFetch([
      () => jsonResponse(200, makeSession(null, 'token-a')),
      refusal,
      () => jsonResponse(200, makeSession(null, 'token-b')),
      refusal,
    ]);
    const api = createApiClient({ fetch });

    const error = await api.delete('/session').catch((e: unknown) => e);

    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({ status: 403, code: 'csrf_invalid' });
    expect(calls).toHaveLength(4);
  });

  it('sends no token on reads', async () => {
    const { fetch, calls } = scriptedFetch([() => jsonResponse(200, { items: [] })]);
    await createApiClient({ fetch }).get('/members', { query: { role: 'admin', page: undefined } });
    expect(calls[0]).toMatchObject({ method: 'GET', url: '/api/members?role=admin', csrf: null });
  });
});

describe('api client: errors', () => {
  it('turns the API error body into an ApiError with code, message and fields', async () => {
    const { fetch } = scriptedFetch([
      () => jsonResponse(200, makeSession(null)),
      () =>
        jsonResponse(409, {
          error: { code: 'email_taken', message: 'That e-mail address already has an account.', fields: { email: 'Already registered.' } },
        }),
    ]);

    const error = await createApiClient({ fetch })
      .post('/members', {})
      .catch((e: unknown) => e);

    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({
      status: 409,
      code: 'email_taken',
      message: 'That e-mail address already has an account.',
      fields: { email: 'Already registered.' },
    });
  });

  it('words a body-less failure itself, never passing on a proxy page', async () => {
    const { fetch } = scriptedFetch([() => new Response('<html>Bad gateway</html>', { status: 502 })]);
    const error = await createApiClient({ fetch })
      .get('/members')
      .catch((e: unknown) => e);
    expect(error).toMatchObject({ status: 502, code: 'service_unavailable' });
    expect((error as Error).message).not.toContain('html');
  });

  it('reports an unreachable server as status 0, service_unavailable', async () => {
    const fetch = vi.fn(async () => {
      throw new TypeError('Failed to fetch');
    }) as unknown as typeof globalThis.fetch;
    const error = await createApiClient({ fetch })
      .get('/health')
      .catch((e: unknown) => e);
    expect(error).toMatchObject({ status: 0, code: 'service_unavailable' });
  });

  it('resolves an empty 204 or 202 answer to undefined', async () => {
    const { fetch } = scriptedFetch([() => jsonResponse(200, makeSession(null)), () => new Response(null, { status: 204 }), () => new Response(null, { status: 202 })]);
    const api = createApiClient({ fetch });
    await expect(api.delete('/session')).resolves.toBeUndefined();
    await expect(api.post('/password-resets', { email: 'hester@larkhollow.example' })).resolves.toBeUndefined();
  });
});
