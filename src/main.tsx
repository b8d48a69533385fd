import { StrictMode } from "react";
import { createRoot } from "react-dom/client";
import { onlineManager } from "@tanstack/react-query";
import "@fontsource-variable/inter/wght.css";
import "./index.css";
import { AppProvider, createQueryClient } from "@/app/provider";
import { createAppRouter } from "@/app/router";
import { authKeys } from "@/features/auth/api/auth.queries";
import { cachedUserId } from "@/lib/offline/owner";
import { registerServiceWorker } from "@/lib/service-worker";

const root = document.getElementById("root");
if (!root) throw new Error("The page has no #root element");

const queryClient = createQueryClient();
// TanStack Query assumes "online" until the browser says otherwise; a page opened with no network starts offline.
onlineManager.setOnline(navigator.onLine);

/**
 * The offline booth (src/app/offline.ts) is loaded for painters only: at start-up when a painter's cache is on this
 * tablet (restored before the first screen, so a reload with no network still shows the cards), or as soon as a
 * painter signs in.
 */
let offline: Promise<void> | null = null;
const start = (restore: boolean) =>
  (offline ??= import("@/app/offline")
    .then((m) => m.startOffline(queryClient, restore))
    .catch(() => undefined));
const ready = cachedUserId() ? start(true) : Promise.resolve();
queryClient.getQueryCache().subscribe((event) => {
  const user = event.query.queryHash === JSON.stringify(authKeys.me()) ? (event.query.state.data as { role?: string } | null | undefined) : undefined;
  if (user?.role === "painter") void start(false);
});

// The router starts loading the page's code and the signed-in user the moment it exists, so it is made before
// React's first render rather than inside it.
void ready.then(() => {
  const router = createAppRouter(queryClient);
  createRoot(root).render(
    <StrictMode>
      <AppProvider queryClient={queryClient} router={router} />
    </StrictMode>,
  );
});
registerServiceWorker();
