import { vi } from 'vitest';

/**
 * Lets integration tests call server actions and route handlers directly, as any user:
 * the session, request headers and cache revalidation that Next provides in a request are stubbed.
 * Everything behind them (role checks that re-read the user, zod, data functions, PostgreSQL) is real.
 */
type TestSession = { user: { id: number; name: string; email: string; role: string; sv: number } } | null;
const state = globalThis as unknown as { __testSession: TestSession; __testHeaders: Record<string, string> };
state.__testSession = null;
state.__testHeaders = {};

vi.mock('next-auth', async (orig) => ({
  ...(await orig<typeof import('next-auth')>()),
  getServerSession: async () => state.__testSession,
}));
vi.mock('next/headers', () => ({
  headers: async () => new Headers(state.__testHeaders),
  cookies: async () => ({
    get: () => undefined,
    getAll: () => [],
    set: () => undefined,
    delete: () => undefined,
    has: () => false,
  }),
}));
vi.mock('next/cache', () => ({
  revalidatePath: () => undefined,
  revalidateTag: () => undefined,
  unstable_cache: <T>(fn: T) => fn,
}));
vi.mock('next/navigation', () => ({
  redirect: (url: string) => {
    throw Object.assign(new Error(`NEXT_REDIRECT ${url}`), { redirectTo: url });
  },
  notFound: () => {
    throw Object.assign(new Error('NEXT_NOT_FOUND'), { notFound: true });
  },
}));
