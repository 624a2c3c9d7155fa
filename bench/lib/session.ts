/**
 * Signs in over HTTP the way the web app does (GET /api/session for a CSRF
 * token, then POST /api/session with it) and returns the session cookie, so
 * a load generator can send it on every request.
 */

/**
 * The API runs with NODE_ENV=production, where the session cookie is Secure.
 * In production a TLS proxy sits in front and says so in this header; the
 * benchmark plays that proxy (the API must trust loopback: TRUST_PROXY=loopback).
 */
export const BEHIND_TLS_PROXY = { 'x-forwarded-proto': 'https' } as const;

function sessionCookie(response: Response): string | undefined {
  for (const header of response.headers.getSetCookie()) {
    const pair = header.split(';', 1)[0]!;
    if (pair.startsWith('sr.sid=')) return pair;
  }
  return undefined;
}

export async function signIn(apiUrl: string, email: string, password: string): Promise<string> {
  const first = await fetch(`${apiUrl}/api/session`, { headers: BEHIND_TLS_PROXY });
  if (first.status !== 200) throw new Error(`GET /api/session answered ${first.status}.`);
  const { csrfToken } = (await first.json()) as { csrfToken: string };
  const anonymous = sessionCookie(first);
  if (anonymous === undefined) throw new Error('GET /api/session set no sr.sid cookie (is TRUST_PROXY=loopback set on the API?).');

  const response = await fetch(`${apiUrl}/api/session`, {
    method: 'POST',
    headers: { ...BEHIND_TLS_PROXY, cookie: anonymous, 'content-type': 'application/json', 'x-csrf-token': csrfToken },
    body: JSON.stringify({ email, password }),
  });
  if (response.status !== 200) throw new Error(`Signing in as ${email} answered ${response.status}: ${await response.text()}`);
  const signedIn = sessionCookie(response);
  if (signedIn === undefined) throw new Error(`Signing in as ${email} set no sr.sid cookie.`);
  return signedIn;
}
