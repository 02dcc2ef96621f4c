import { getDb } from '@/lib/db';

type State = { __testSession: unknown; __testHeaders: Record<string, string> };
const state = globalThis as unknown as State;

/** Acts as this user (by e-mail) in the following direct calls; null = signed out. */
export async function signInAs(email: string | null): Promise<{ id: number; role: string } | null> {
  if (!email) {
    state.__testSession = null;
    return null;
  }
  const u = await getDb().models.User.findOne({ where: { email } });
  if (!u) throw new Error(`No test user ${email}`);
  state.__testSession = { user: { id: u.id, name: u.name, email: u.email, role: u.role, sv: u.sessionVersion } };
  return { id: u.id, role: u.role };
}

/** Replays an old session as-is (e.g. after sign-out or a role change), like a copied cookie. */
export function replaySession(session: unknown): void {
  state.__testSession = session;
}

export function currentTestSession(): unknown {
  return state.__testSession;
}

export function setRequestHeaders(headers: Record<string, string>): void {
  state.__testHeaders = headers;
}

export const DEMO = {
  owner: 'owner@hollowmere.test',
  keeper: 'keeper@hollowmere.test',
  keeper2: 'keeper2@hollowmere.test',
  crew: 'crew@hollowmere.test',
  customer: 'customer@hollowmere.test',
} as const;

/**
 * Request headers as proxy.ts leaves them for a client at `ip` (lib/http/client-ip.ts): the socket
 * address in x-forwarded-for, what the client itself sent in the moved-aside header, and the proof.
 * Needs NEXTAUTH_SECRET (the proof is derived from it).
 */
export async function headersFromClient(ip: string, sentForwardedFor = ''): Promise<Record<string, string>> {
  const { FORWARDED_CHAIN_HEADER, PROXY_PROOF_HEADER, proxyProof } = await import('@/lib/http/client-ip');
  return { 'x-forwarded-for': ip, [FORWARDED_CHAIN_HEADER]: sentForwardedFor, [PROXY_PROOF_HEADER]: proxyProof() };
}
