import type { ComponentType } from "react";
import { createBrowserRouter, Outlet, type LoaderFunctionArgs } from "react-router";
import { onlineManager, type QueryClient } from "@tanstack/react-query";
import { NavigationProgress } from "@/components/ui/navigation-progress";
import { FullPageSpinner } from "@/components/ui/spinner";
import { authQueries } from "@/features/auth/api/auth.queries";
import { serverStatusQueries } from "@/lib/server-status.queries";
import { HomeRedirect } from "./routes/home-redirect";
import { NotFoundPage } from "./routes/not-found";
import { RouteError } from "./routes/route-error";

/**
 * A route module: its screen, and optionally `prefetch`, which starts the screen's queries the moment the module has
 * loaded, so the data is on its way while the screen renders for the first time. It must not wait for them.
 */
export type RouteModule = { default: ComponentType; prefetch?: (queryClient: QueryClient, args: LoaderFunctionArgs) => void };

/** Loads a route module on first visit: each screen (and the portal apart from the staff app) is its own chunk. */
function lazyPage(queryClient: QueryClient) {
  return (load: () => Promise<RouteModule>) => async () => {
    const { default: Component, prefetch } = await load();
    return prefetch ? { Component, loader: (args: LoaderFunctionArgs) => (prefetch(queryClient, args), null) } : { Component };
  };
}

export type AppRouter = ReturnType<typeof createAppRouter>;

/** Every screen, with the bar that shows while the next one loads. */
function RootLayout() {
  return (
    <>
      <NavigationProgress />
      <Outlet />
    </>
  );
}

export function createAppRouter(queryClient: QueryClient) {
  const page = lazyPage(queryClient);
  return createBrowserRouter([
    {
      id: "root",
      // Who is signed in is known before anything renders; the gates read it from the cache.
      loader: async () => {
        // Offline, a query waits for the network: the painter's user comes from the tablet's cache (src/app/offline.ts),
        // and with nothing cached the sign-in page shows (it says the server cannot be reached).
        const online = onlineManager.isOnline();
        if (!online && queryClient.getQueryData(authQueries.me().queryKey) === undefined) queryClient.setQueryData(authQueries.me().queryKey, null);
        // The health check (is this a demo with an outbox?) rides along, so the owner's menu is right at first paint.
        const health = queryClient.prefetchQuery(serverStatusQueries.health());
        await Promise.all([queryClient.ensureQueryData(authQueries.me()), online ? health : null]);
        return null;
      },
      shouldRevalidate: () => false,
      Component: RootLayout,
      HydrateFallback: FullPageSpinner,
      ErrorBoundary: RouteError,
      children: [
        { index: true, Component: HomeRedirect },
        {
          lazy: page(() => import("./routes/auth/auth-pages-layout")),
          children: [
            { path: "sign-in", lazy: page(() => import("./routes/auth/sign-in")) },
            { path: "forgot-password", lazy: page(() => import("./routes/auth/forgot-password")) },
            { path: "reset-password", lazy: page(() => import("./routes/auth/reset-password")) },
          ],
        },
        {
          lazy: page(() => import("./routes/staff/staff-layout")),
          children: [
            { path: "board", lazy: page(() => import("./routes/staff/board")) },
            { path: "jobs", lazy: page(() => import("./routes/staff/jobs")) },
            { path: "jobs/new", lazy: page(() => import("./routes/staff/new-job")) },
            { path: "jobs/:jobId", lazy: page(() => import("./routes/staff/job")) },
            { path: "customers", lazy: page(() => import("./routes/staff/customers")) },
            { path: "customers/new", lazy: page(() => import("./routes/staff/new-customer")) },
            { path: "customers/:customerId", lazy: page(() => import("./routes/staff/customer")) },
            { path: "users", lazy: page(() => import("./routes/staff/users")) },
            { path: "outbox", lazy: page(() => import("./routes/staff/outbox")) },
            { path: "account", lazy: page(() => import("./routes/account")) },
            { path: "materials", lazy: page(() => import("./routes/staff/materials")) },
            { path: "materials/new", lazy: page(() => import("./routes/staff/new-material")) },
            { path: "materials/:materialId", lazy: page(() => import("./routes/staff/material")) },
            { path: "plans", lazy: page(() => import("./routes/staff/plans")) },
            { path: "plans/new", lazy: page(() => import("./routes/staff/plan-edit")) },
            { path: "plans/:planId", lazy: page(() => import("./routes/staff/plan")) },
            { path: "plans/:planId/edit", lazy: page(() => import("./routes/staff/plan-edit")) },
            { path: "plans/:planId/versions/:versionId", lazy: page(() => import("./routes/staff/plan-version")) },
            { path: "jobs/:jobId/plan", lazy: page(() => import("./routes/staff/job-plan")) },
            { path: "mix-sheets/:sheetId", lazy: page(() => import("./routes/staff/mix-sheet")) },
            { path: "mix", lazy: page(() => import("./routes/staff/mix-calculator")) },
            { path: "booth", lazy: page(() => import("./routes/staff/booth")) },
            { path: "booth/:jobId", lazy: page(() => import("./routes/staff/booth-card")) },
            { path: "jobs/:jobId/prep", lazy: page(() => import("./routes/staff/job-prep")) },
            { path: "jobs/:jobId/inspection", lazy: page(() => import("./routes/staff/job-inspection")) },
            { path: "jobs/:jobId/ticket", lazy: page(() => import("./routes/staff/job-ticket")) },
            { path: "jobs/:jobId/finish-record", lazy: page(() => import("./routes/staff/job-finish-record")) },
            { path: "panels", lazy: page(() => import("./routes/staff/panels")) },
            { path: "panels/new", lazy: page(() => import("./routes/staff/new-panel")) },
            { path: "panels/compare", lazy: page(() => import("./routes/staff/panels-compare")) },
            { path: "panels/ladder", lazy: page(() => import("./routes/staff/panels-ladder")) },
            { path: "panels/:panelId", lazy: page(() => import("./routes/staff/panel")) },
            { path: "quotes", lazy: page(() => import("./routes/staff/quotes")) },
            { path: "quotes/:quoteId", lazy: page(() => import("./routes/staff/quote")) },
            { path: "dashboard", lazy: page(() => import("./routes/staff/dashboard")) },
            { path: "compliance", lazy: page(() => import("./routes/staff/compliance")) },
            { path: "audit", lazy: page(() => import("./routes/staff/audit")) },
            { path: "payments", lazy: page(() => import("./routes/staff/payments")) },
            { path: "schedule", lazy: page(() => import("./routes/staff/schedule")) },
            { path: "settings", lazy: page(() => import("./routes/staff/settings")) },
          ],
        },
        {
          path: "portal",
          lazy: page(() => import("./routes/portal/portal-layout")),
          children: [
            { index: true, lazy: page(() => import("./routes/portal/my-jobs")) },
            { path: "account", lazy: page(() => import("./routes/account")) },
            { path: "quotes", lazy: page(() => import("./routes/portal/my-quotes")) },
            { path: "quotes/:quoteId", lazy: page(() => import("./routes/portal/portal-quote")) },
            { path: "jobs/:jobId", lazy: page(() => import("./routes/portal/portal-job")) },
            { path: "jobs/:jobId/colour", lazy: page(() => import("./routes/portal/portal-job")) },
            { path: "jobs/:jobId/finish-record", lazy: page(() => import("./routes/portal/portal-finish-record")) },
            { path: "change-orders/:changeOrderId", lazy: page(() => import("./routes/portal/portal-change-order")) },
          ],
        },
        // A quote opened from the e-mail link: no sign-in, no navigation, that one quote.
        { path: "portal/link/:token", lazy: page(() => import("./routes/portal/quote-link")) },
        { path: "*", Component: NotFoundPage },
      ],
    },
  ]);
}
