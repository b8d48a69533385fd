import type { ReactNode } from "react";
import { CircleAlert, CircleCheck, Info, TriangleAlert } from "lucide-react";
import { cn } from "@/utils/cn";

type Tone = "error" | "success" | "info" | "warning";

const TONES: Record<Tone, { className: string; Icon: typeof Info }> = {
  error: { className: "border-red-700 bg-red-50 text-red-950", Icon: CircleAlert },
  success: { className: "border-emerald-700 bg-emerald-50 text-emerald-950", Icon: CircleCheck },
  info: { className: "border-ink-500 bg-ink-50 text-ink-950", Icon: Info },
  warning: { className: "border-flake-600 bg-flake-50 text-flake-900", Icon: TriangleAlert },
};

/** An inline message. Errors are announced (role="alert"); the rest are polite status messages. */
export function Alert({ tone = "info", title, children, className }: { tone?: Tone; title?: ReactNode; children?: ReactNode; className?: string }) {
  const { className: toneClass, Icon } = TONES[tone];
  return (
    <div role={tone === "error" ? "alert" : "status"} className={cn("flex gap-3 rounded-lg border-l-4 px-4 py-3 text-sm", toneClass, className)}>
      <Icon aria-hidden className="mt-0.5 size-5 shrink-0" />
      <div className="min-w-0 space-y-1">
        {title ? <p className="font-semibold">{title}</p> : null}
        {children ? <div>{children}</div> : null}
      </div>
    </div>
  );
}
