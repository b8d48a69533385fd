/**
 * Which source modules belong to the staff screens and which to the customer portal, for the route-splitting checks
 * (tests/e2e/a11y.spec.ts and `npm run bench`). Module paths are as dist/.vite/chunk-modules.json lists them.
 */
/** The customer's side of change orders lives in the change-orders feature under portal-* names. */
const PORTAL_CHANGE_ORDERS = /^src\/features\/change-orders\/(api|components)\/portal-/;
export const STAFF_CODE = [/^src\/app\/routes\/staff\//, /^src\/config\/nav\.ts$/, /^src\/components\/layouts\/app-shell\./, /^src\/features\/(?!auth\/|portal\/)(?!change-orders\/(api|components)\/portal-)/];
export const PORTAL_CODE = [/^src\/app\/routes\/portal\//, /^src\/components\/layouts\/portal-shell\./, /^src\/features\/portal\//, PORTAL_CHANGE_ORDERS];

/**
 * Display pieces that live beside the staff features and that the portal shows too: no queries, no mutations and
 * no staff screen behind them. Anything else from a staff feature in a portal download is a failure.
 */
export const SHARED_DISPLAY = new Set([
  "src/features/jobs/components/stage-badge.tsx",
  "src/features/jobs/components/item-area.ts",
  "src/features/panels/components/panel-swatch.tsx",
  "src/features/finish-record/components/finish-record-view.tsx",
  "src/features/change-orders/components/change-order-view.tsx",
]);

export const isStaffCode = (module: string) => STAFF_CODE.some((re) => re.test(module)) && !SHARED_DISPLAY.has(module);
export const isPortalCode = (module: string) => PORTAL_CODE.some((re) => re.test(module));
