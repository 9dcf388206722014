import { type Session, SessionSchema } from '@plummet/shared';

/** Signs in through the real `POST /api/auth/sign-in` route; throws with the error body otherwise. */
export async function signIn(baseUrl: string, email: string, password = 'plummet-demo'): Promise<Session> {
  const res = await fetch(`${baseUrl}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email, password }),
  });
  const body: unknown = await res.json();
  if (res.status !== 200) throw new Error(`sign-in of ${email} answered ${res.status}: ${JSON.stringify(body)}`);
  return SessionSchema.parse(body);
}

/** `Authorization` header for a session or a bare access token. */
export function bearer(session: Session | string): { authorization: string } {
  return { authorization: `Bearer ${typeof session === 'string' ? session : session.accessToken}` };
}
