import { RotateCcw, TriangleAlert } from "lucide-react";
import { isApiError } from "@/lib/api-client";
import { Button } from "../ui/button";

function describe(error: unknown): { title: string; detail: string; reference?: string | null } {
  if (isApiError(error)) {
    if (error.status === 0) return { title: "Can't reach Coatwright", detail: error.message };
    if (error.status >= 500) return { title: "The server had a problem", detail: error.message, reference: error.requestId };
    return { title: "That didn't work", detail: error.message };
  }
  if (error instanceof Error && /dynamically imported module|Importing a module script failed/i.test(error.message))
    return { title: "A new version is available", detail: "Reload the page to get the latest Coatwright." };
  return { title: "Something went wrong", detail: "This screen hit an unexpected problem. Nothing you saved has been lost." };
}

/** What the user sees when a screen cannot be shown. It takes the place of the page, so it carries the <h1>. */
export function ErrorFallback({ error, onRetry }: { error: unknown; onRetry?: () => void }) {
  const { title, detail, reference } = describe(error);
  return (
    <div role="alert" className="mx-auto my-10 flex max-w-lg flex-col items-center gap-4 rounded-2xl border border-primer-200 bg-white p-8 text-center shadow-card">
      <TriangleAlert aria-hidden className="size-10 text-flake-600" />
      <div>
        <h1 className="text-xl font-bold text-ink-950">{title}</h1>
        <p className="mt-2 text-primer-700">{detail}</p>
        {reference ? (
          <p className="mt-2 text-sm text-primer-700">
            If you report this, quote the reference <span className="font-mono break-all text-ink-950 select-all">{reference}</span>.
          </p>
        ) : null}
      </div>
      <div className="flex flex-wrap justify-center gap-3">
        {onRetry ? (
          <Button onClick={onRetry} icon={<RotateCcw aria-hidden className="size-4" />}>
            Try again
          </Button>
        ) : null}
        <Button variant="secondary" onClick={() => window.location.reload()}>
          Reload page
        </Button>
      </div>
    </div>
  );
}
