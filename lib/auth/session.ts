import 'server-only';
import { getServerSession } from 'next-auth';
import { redirect } from 'next/navigation';
import { authOptions } from './options';
import { can, type Permission, type Role } from './roles';
import { getActiveUser } from '@/lib/data/staff/users';

export type SessionUser = { id: number; name: string; email: string; role: Role };

/**
 * The signed-in user, re-read from the database on every call: a disabled account, a changed
 * role or a bumped session version takes effect on the very next request (ASVS 7.4.2, 8.3.2).
 */
export async function currentUser(): Promise<SessionUser | null> {
  const session = await getServerSession(authOptions);
  if (!session?.user?.id) return null;
  const user = await getActiveUser(session.user.id);
  if (!user || session.user.sv !== user.sessionVersion) return null;
  return { id: user.id, name: user.name, email: user.email, role: user.role };
}

export class AuthError extends Error {
  constructor(
    public status: 401 | 403,
    message: string,
  ) {
    super(message);
  }
}

/** ASVS 16.3.2: a refused request is logged by who and what, never with the request's data. */
function logRefusal(user: SessionUser, permission: Permission): void {
  console.warn(`[auth] refused ${permission} user=${user.id} role=${user.role}`);
}

/** For server actions and route handlers: the user if allowed, else an AuthError (401/403). */
export async function authorize(permission: Permission): Promise<SessionUser> {
  const user = await currentUser();
  if (!user) throw new AuthError(401, 'Please sign in first.');
  if (!can(user.role, permission)) {
    logRefusal(user, permission);
    throw new AuthError(403, 'Your account is not allowed to do that.');
  }
  return user;
}

/** For pages: sends a signed-out visitor to sign in, and a signed-in one without the right to /forbidden. */
export async function requirePermission(permission: Permission, from = '/admin'): Promise<SessionUser> {
  const user = await currentUser();
  if (!user) redirect(`/sign-in?next=${encodeURIComponent(from)}`);
  if (!can(user.role, permission)) {
    logRefusal(user, permission);
    redirect('/forbidden');
  }
  return user;
}
