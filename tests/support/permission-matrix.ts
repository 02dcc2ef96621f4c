import type { Role } from '@/lib/auth/roles';

/**
 * THE committed permission matrix (issue 8, ASVS 8.1.1): every server action and route handler of
 * the app × anonymous, customer, keeper, crew, owner. `tests/data/permission-matrix.test.ts` finds
 * every export itself and fails when one is missing here, or when a role not listed gets through.
 * 'anyone' = no sign-in needed (the handler then guards itself: signature, token, public data).
 */
export type Who = Role | 'anonymous';
export type Allowed = 'anyone' | readonly Who[];

const OWNER = ['owner'] as const;
const STAFF = ['owner', 'keeper', 'crew'] as const;
const HARVEST_WRITE = ['owner', 'keeper'] as const;
const HOUSE = ['owner', 'crew'] as const;

export const ACTIONS: Record<string, Allowed> = {
  'app/(auth)/actions.ts#signUpAction': 'anyone',
  'app/(auth)/actions.ts#forgotPasswordAction': 'anyone',
  'app/(auth)/actions.ts#resetPasswordAction': 'anyone',
  'app/(back-office)/admin/settings/actions.ts#saveSettingsAction': OWNER,
  'app/(back-office)/admin/staff/actions.ts#createStaffAction': OWNER,
  'app/(back-office)/admin/staff/actions.ts#updateStaffAction': OWNER,
};

/** Route handlers: `path#METHOD`. Dynamic segments are filled with ids that do not exist. */
export const ROUTES: Record<string, Allowed> = {
  'app/api/health/route.ts#GET': 'anyone',
  'app/welcome/route.ts#GET': 'anyone',
  'app/api/auth/[...nextauth]/route.ts#GET': 'anyone',
  'app/api/auth/[...nextauth]/route.ts#POST': 'anyone',
  'app/api/settings/route.ts#GET': OWNER,
  'app/api/settings/route.ts#PUT': OWNER,
};

export const GROUPS = { OWNER, STAFF, HARVEST_WRITE, HOUSE };
