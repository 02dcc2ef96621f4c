import type { Role } from '@/lib/auth/roles';

/**
 * THE committed permission matrix (ASVS 8.1.1): every server action and route handler of
 * the app × anonymous, customer, keeper, crew, owner. `tests/data/permission-matrix.test.ts` finds
 * every export itself and fails when one is missing here, or when a role not listed gets through.
 * 'anyone' = no sign-in needed (the handler then guards itself: signature, token, public data).
 */
export type Who = Role | 'anonymous';
export type Allowed = 'anyone' | readonly Who[];

const OWNER = ['owner'] as const;
const STAFF = ['owner', 'keeper', 'crew'] as const;
const YARD_WORK = ['owner', 'keeper'] as const;
const HOUSE = ['owner', 'crew'] as const;

export const ACTIONS: Record<string, Allowed> = {
  'app/(auth)/actions.ts#signUpAction': 'anyone',
  'app/(auth)/actions.ts#forgotPasswordAction': 'anyone',
  'app/(auth)/actions.ts#resetPasswordAction': 'anyone',
  'app/(back-office)/admin/settings/actions.ts#saveSettingsAction': OWNER,
  'app/(back-office)/admin/staff/actions.ts#createStaffAction': OWNER,
  'app/(back-office)/admin/staff/actions.ts#updateStaffAction': OWNER,
  ...Object.fromEntries(
    [
      'createLotAction',
      'updateLotAction',
      'scanSuperAction',
      'pickSupersAction',
      'removeSuperAction',
      'emptyWeightAction',
      'addContainerAction',
      'waxAction',
      'addReadingAction',
      'voidRecordAction',
      'changeStageAction',
      'createBlendAction',
    ].map((name) => [`app/(back-office)/admin/lots/actions.ts#${name}`, HOUSE]),
  ),
  'app/(back-office)/admin/lots/actions.ts#saveContainerTypeAction': OWNER,
  // Yards, colonies and supers. Scope (a keeper's own yards) is checked in lib/data: tests/data/yards/scope.test.ts.
  'app/(back-office)/admin/yards/actions.ts#createYardAction': OWNER,
  'app/(back-office)/admin/yards/actions.ts#updateYardAction': OWNER,
  'app/(back-office)/admin/yards/actions.ts#recordPullsAction': YARD_WORK,
  'app/(back-office)/admin/colonies/actions.ts#createColonyAction': YARD_WORK,
  'app/(back-office)/admin/colonies/actions.ts#updateColonyAction': YARD_WORK,
  'app/(back-office)/admin/colonies/actions.ts#moveColonyAction': YARD_WORK,
  'app/(back-office)/admin/colonies/actions.ts#colonyStatusAction': YARD_WORK,
  'app/(back-office)/admin/colonies/actions.ts#splitColonyAction': YARD_WORK,
  'app/(back-office)/admin/colonies/actions.ts#colonyNoteAction': YARD_WORK,
  'app/(back-office)/admin/colonies/actions.ts#addFeedingAction': YARD_WORK,
  'app/(back-office)/admin/colonies/actions.ts#endFeedingAction': YARD_WORK,
  'app/(back-office)/admin/colonies/actions.ts#addTreatmentAction': YARD_WORK,
  'app/(back-office)/admin/colonies/actions.ts#endTreatmentAction': YARD_WORK,
  'app/(back-office)/admin/colonies/actions.ts#superOnAction': YARD_WORK,
  'app/(back-office)/admin/treatment-kinds/actions.ts#saveTreatmentKindAction': OWNER,
  'app/(back-office)/admin/supers/actions.ts#createTagBatchAction': OWNER,
  'app/(back-office)/admin/supers/actions.ts#voidSuperPullAction': YARD_WORK, // scope: tests/data/supers/void.test.ts
  'app/(back-office)/admin/products/actions.ts#saveProductAction': OWNER,
  'app/(back-office)/admin/jarring/actions.ts#createJarringRunAction': HOUSE,
  'app/(back-office)/admin/jarring/actions.ts#overrideJarringRunAction': OWNER,
  'app/(back-office)/admin/stock/actions.ts#adjustStockAction': HOUSE,
  'app/(back-office)/admin/labels/actions.ts#saveLabelLayoutAction': OWNER,
  'app/(back-office)/admin/labels/actions.ts#deleteLabelLayoutAction': OWNER,
  // Order desk (orders.desk / orders.refund: owner and crew).
  'app/(back-office)/admin/orders/actions.ts#markPackedAction': HOUSE,
  'app/(back-office)/admin/orders/actions.ts#markShippedAction': HOUSE,
  'app/(back-office)/admin/orders/actions.ts#markPickedUpAction': HOUSE,
  'app/(back-office)/admin/orders/actions.ts#cancelOrderAction': HOUSE,
  'app/(back-office)/admin/orders/actions.ts#refundOrderAction': HOUSE,
  'app/(back-office)/admin/reports/actions.ts#seasonRecipientsAction': OWNER,
  'app/(back-office)/admin/reports/actions.ts#sendKeeperReportAction': OWNER,
};

/** Route handlers: `path#METHOD`. Dynamic segments are filled with ids that do not exist. */
export const ROUTES: Record<string, Allowed> = {
  'app/api/health/route.ts#GET': 'anyone',
  'app/welcome/route.ts#GET': 'anyone',
  'app/api/auth/[...nextauth]/route.ts#GET': 'anyone',
  'app/api/auth/[...nextauth]/route.ts#POST': 'anyone',
  'app/api/settings/route.ts#GET': OWNER,
  'app/api/settings/route.ts#PUT': OWNER,
  'app/api/lots/route.ts#GET': STAFF,
  'app/api/lots/[id]/lab-files/route.ts#POST': HOUSE,
  'app/api/lab-files/[id]/route.ts#GET': STAFF,
  'app/api/yards/route.ts#GET': STAFF,
  'app/api/colonies/route.ts#GET': STAFF,
  'app/api/colonies/detail/route.ts#GET': STAFF,
  'app/api/super-pulls/route.ts#GET': STAFF,
  'app/api/super-pulls/route.ts#POST': YARD_WORK,
  'app/api/super-pulls/import/route.ts#POST': YARD_WORK,
  'app/api/super-tags/sheet/route.ts#GET': OWNER,
  'app/api/products/[id]/photo/route.ts#GET': 'anyone', // a product's photo, for the shop
  'app/api/products/[id]/photo/route.ts#POST': OWNER,
  'app/api/jarring/route.ts#GET': STAFF,
  'app/api/jarring/[id]/labels/route.ts#GET': HOUSE,
  // Shop: public catalogue and checkout; the webhook guards itself with Stripe's signature, the
  // cancel link with the order's HMAC token.
  'app/api/products/route.ts#GET': 'anyone',
  'app/api/checkout/route.ts#POST': 'anyone',
  'app/api/stripe/webhook/route.ts#POST': 'anyone',
  'app/(storefront)/checkout/cancelled/route.ts#GET': 'anyone',
  'app/(back-office)/admin/orders/[id]/packing-slip/route.ts#GET': HOUSE,
  'app/api/orders/route.ts#GET': HOUSE,
  'app/api/account/orders/route.ts#GET': ['customer'],
  'app/api/stock/ledger/route.ts#GET': STAFF,
  'app/api/reports/csv/route.ts#GET': ['owner', 'keeper'],
  'app/api/reports/keeper-pdf/route.ts#GET': ['owner', 'keeper'],
  'app/api/trace/recall/route.ts#GET': HOUSE,
};

/**
 * Per-record scope (one rule for lots, jarring, stock and trace): a keeper reads only what came from
 * their own colonies' lots (lib/data/lots/access.ts, readableLotIds/canReadLot); a record from another
 * keeper's lot is "not found", never shown. Owner and crew read every lot. Checked record by record in
 * tests/data/permission-matrix.test.ts.
 */
export const KEEPER_SCOPE = [
  "lot page of another keeper's lot: not found",
  "jarring run of another keeper's lot (page and /api/jarring list): not found / not listed",
  "stock rows and totals of another keeper's lot (stock page): not listed",
  "stock ledger entries of another keeper's lot (/api/stock/ledger): not listed",
  'trace and recall list (/api/trace/recall): owner and crew only (403)',
] as const;

export const GROUPS = { OWNER, STAFF, YARD_WORK, HOUSE };
