import { MutationCache, QueryCache, QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { RouterProvider } from "react-router";
import { isApiError } from "@/lib/api-client";
import { toast } from "@/components/ui/toast/toast-store";
import { Toaster } from "@/components/ui/toast/toaster";
import { authKeys } from "@/features/auth/api/auth.queries";
import type { AppRouter } from "./router";

/** Errors the screen cannot work around: server faults, an unreachable server, bugs. They go to an error boundary. */
function isFatal(error: unknown): boolean {
  return !isApiError(error) || error.isServerError;
}

/**
 * The error policy, in one place:
 * - 401 anywhere: the session is over; forget the user, and the access gate sends them to sign-in.
 * - 4xx: handled where it happens (form fields, inline messages, "not found" states).
 * - 5xx / network on a first load: thrown to the nearest error boundary.
 * - Any failure of a background refresh while data is on screen: a toast, and the old data stays.
 * - 5xx on a write: the error boundary (forms show 4xx and network failures themselves).
 * - 409 version_conflict on a write (someone saved the record first): what is on screen is refetched, so the form
 *   (which keeps what was typed) now holds the newer version: saving again applies the user's change over theirs,
 *   cancelling keeps theirs. The plan editor offers both as buttons.
 */
export function createQueryClient() {
  const queryClient: QueryClient = new QueryClient({
    queryCache: new QueryCache({
      onError: (error, query) => {
        if (isApiError(error) && error.status === 401) return endSession();
        if (query.state.data !== undefined) toast.error(`Could not refresh: ${error.message}`);
      },
    }),
    mutationCache: new MutationCache({
      onError: (error) => {
        if (isApiError(error) && error.status === 401) endSession();
        if (isApiError(error) && error.code === "version_conflict") void queryClient.invalidateQueries();
      },
    }),
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        retry: (failureCount, error) => !(isApiError(error) && error.isClientError) && failureCount < 2,
        throwOnError: (error, query) => isFatal(error) && query.state.data === undefined,
      },
      mutations: {
        throwOnError: (error) => !isApiError(error) || error.status >= 500,
      },
    },
  });

  function endSession() {
    if (!queryClient.getQueryData(authKeys.me())) return;
    queryClient.setQueryData(authKeys.me(), null);
    toast.info("Your session has ended. Sign in again to carry on.");
  }

  return queryClient;
}

/** Made before the first render (see main.tsx), so the router is already fetching the page's code and data. */
export function AppProvider({ queryClient, router }: { queryClient: QueryClient; router: AppRouter }) {
  return (
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
      <Toaster />
    </QueryClientProvider>
  );
}
