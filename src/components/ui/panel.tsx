import type { ReactNode } from "react";
import { cn } from "@/utils/cn";

/** A white section with an <h2>; `actions` sit on the heading row. */
export function Panel({
  title,
  titleId,
  actions,
  children,
  className,
  bodyClassName,
  flush = false,
}: {
  title?: ReactNode;
  titleId?: string;
  actions?: ReactNode;
  children: ReactNode;
  className?: string;
  bodyClassName?: string;
  /** No padding around the body (for tables that run edge to edge). */
  flush?: boolean;
}) {
  return (
    <section
      aria-labelledby={title ? titleId : undefined}
      className={cn("rounded-xl border border-primer-200 bg-white shadow-card", flush && "overflow-hidden", className)}
    >
      {title ? (
        <div className="flex flex-wrap items-center justify-between gap-3 border-b border-primer-200 px-4 py-3 sm:px-5">
          <h2 id={titleId} className="text-lg font-semibold text-ink-950">
            {title}
          </h2>
          {actions ? <div className="flex flex-wrap gap-2">{actions}</div> : null}
        </div>
      ) : null}
      <div className={cn(!flush && "p-4 sm:p-5", bodyClassName)}>{children}</div>
    </section>
  );
}
