import { isRouteErrorResponse, useLocation, useNavigate, useRouteError } from "react-router";
import { useQueryErrorResetBoundary } from "@tanstack/react-query";
import { ErrorFallback } from "@/components/errors/error-fallback";
import { NotFoundPage } from "./not-found";

/** The last line of defence: any error no screen handled (a failed chunk, a server fault while loading the session). */
export function RouteError() {
  const error = useRouteError();
  const { reset } = useQueryErrorResetBoundary();
  const navigate = useNavigate();
  const location = useLocation();
  if (isRouteErrorResponse(error) && error.status === 404) return <NotFoundPage />;
  return (
    <main id="main" className="px-4 py-10">
      <title>Problem · Coatwright</title>
      <ErrorFallback
        error={error}
        onRetry={() => {
          reset();
          navigate(`${location.pathname}${location.search}`, { replace: true });
        }}
      />
    </main>
  );
}
