import type { ReactNode } from "react";
import { useLocation } from "react-router";
import { QueryErrorResetBoundary } from "@tanstack/react-query";
import { ErrorBoundary } from "@/components/errors/error-boundary";
import { ErrorFallback } from "@/components/errors/error-fallback";

/** Keeps the frame (navigation, sign out) on screen when one page fails; "Try again" refetches what failed. */
export function ScreenBoundary({ children }: { children: ReactNode }) {
  const { pathname } = useLocation();
  return (
    <QueryErrorResetBoundary>
      {({ reset }) => (
        <ErrorBoundary resetKeys={[pathname]} onReset={reset} fallback={({ error, reset: retry }) => <ErrorFallback error={error} onRetry={retry} />}>
          {children}
        </ErrorBoundary>
      )}
    </QueryErrorResetBoundary>
  );
}
