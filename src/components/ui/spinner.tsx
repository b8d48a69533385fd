import { LoaderCircle } from "lucide-react";
import { cn } from "@/utils/cn";

export function Spinner({ label = "Loading…", className }: { label?: string; className?: string }) {
  return (
    <div role="status" className={cn("flex items-center justify-center gap-3 py-10 text-primer-700", className)}>
      <LoaderCircle aria-hidden className="size-6 animate-spin text-candy-600" />
      <span className="text-sm font-medium">{label}</span>
    </div>
  );
}

export function FullPageSpinner() {
  return (
    <div className="grid min-h-dvh place-items-center">
      <Spinner label="Loading Coatwright…" />
    </div>
  );
}
