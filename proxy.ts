import { withAuth } from 'next-auth/middleware';

// Only a convenience: signed-out visitors to the back office go to sign-in. The real checks are
// in every page, action and route handler (lib/auth/session.ts), which re-read the user.
export default withAuth({
  callbacks: { authorized: ({ token }) => Boolean(token?.role && token.role !== 'customer') },
  pages: { signIn: '/sign-in' },
});

export const config = { matcher: ['/admin/:path*'] };
