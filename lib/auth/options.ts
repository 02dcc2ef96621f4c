import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import { authenticate } from '@/lib/data/auth/sign-in';
import { bumpSessionVersion, getActiveUser } from '@/lib/data/staff/users';
import { isRole, type Role } from './roles';
import { clientIp } from '@/lib/http/client-ip';
import { safeAuthRedirect } from '@/lib/http/redirect-target';
import { signInInput } from '@/lib/schemas/auth';
import { PasswordHashingBusyError } from './password';

declare module 'next-auth' {
  interface Session {
    user: { id: number; name: string; email: string; role: Role; sv: number };
  }
  interface User {
    role: Role;
    sessionVersion: number;
  }
}
declare module 'next-auth/jwt' {
  interface JWT {
    uid?: number;
    role?: Role;
    sv?: number;
  }
}

/**
 * The session cookie, stated here rather than left to defaults (ASVS 3.3.1–3.3.4): never readable by
 * scripts, not sent on cross-site subrequests, and over HTTPS `Secure` with the `__Secure-` prefix.
 * proxy.ts's getToken and the public page cache find it under either name.
 */
export function sessionCookie(appUrl = process.env.NEXTAUTH_URL ?? '') {
  const secure = appUrl.startsWith('https://');
  return {
    name: `${secure ? '__Secure-' : ''}next-auth.session-token`,
    options: { httpOnly: true, sameSite: 'lax' as const, path: '/', secure },
  };
}

export const authOptions: NextAuthOptions = {
  secret: process.env.NEXTAUTH_SECRET,
  session: { strategy: 'jwt', maxAge: 8 * 60 * 60 },
  cookies: { sessionToken: sessionCookie() },
  pages: { signIn: '/sign-in', error: '/sign-in' },
  providers: [
    CredentialsProvider({
      name: 'E-mail and password',
      credentials: { email: { label: 'E-mail', type: 'email' }, password: { label: 'Password', type: 'password' } },
      async authorize(raw, req) {
        const parsed = signInInput.safeParse(raw);
        if (!parsed.success) return null;
        const ip = clientIp(req?.headers as Record<string, unknown> | undefined);
        const result = await authenticate(parsed.data.email, parsed.data.password, ip).catch((err) => {
          // Too many hashes waiting (lib/auth/password.ts): say so rather than hang.
          if (err instanceof PasswordHashingBusyError) throw new Error('Busy');
          throw err;
        });
        if (result.status === 'throttled') throw new Error('Throttled');
        if (result.status !== 'ok') return null;
        const u = result.user;
        return { id: String(u.id), name: u.name, email: u.email, role: u.role, sessionVersion: u.sessionVersion };
      },
    }),
  ],
  callbacks: {
    // Only our own pages after sign-in or sign-out (callbackUrl is written by whoever made the link).
    redirect({ url, baseUrl }) {
      return safeAuthRedirect(url, baseUrl);
    },
    /**
     * Every read of a session, next-auth's own /api/auth/session included, re-reads the user: a
     * cookie from before a sign-out, a disabling or a role change comes back empty (ASVS 7.4.1),
     * exactly as currentUser() refuses it for the app's pages.
     */
    async jwt({ token, user }) {
      if (user) {
        token.uid = Number(user.id);
        token.role = user.role;
        token.sv = user.sessionVersion;
        return token;
      }
      if (!token.uid) return {};
      const current = await getActiveUser(token.uid);
      if (!current || current.sessionVersion !== token.sv || current.role !== token.role) return {};
      return token;
    },
    async session({ session, token }) {
      if (!token.uid || !isRole(token.role)) return {} as typeof session;
      session.user = {
        id: token.uid,
        name: token.name ?? '',
        email: token.email ?? '',
        role: token.role,
        sv: token.sv ?? 0,
      };
      return session;
    },
  },
  events: {
    // Signing out ends every session of that user, including a copied cookie (ASVS 7.4.1).
    async signOut({ token }) {
      if (token?.uid) await bumpSessionVersion(token.uid);
    },
  },
};
