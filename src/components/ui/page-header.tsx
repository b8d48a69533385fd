import type { ReactNode } from "react";
import { cn } from "@/utils/cn";

/** The page's one <h1>, its document title, an optional line below it and actions on the right. */
export function PageHeader({
  title,
  documentTitle,
  eyebrow,
  description,
  actions,
  className,
}: {
  title: ReactNode;
  /** Plain text for the browser tab when `title` is not a string. */
  documentTitle?: string;
  eyebrow?: ReactNode;
  description?: ReactNode;
  actions?: ReactNode;
  className?: string;
}) {
  const tabTitle = documentTitle ?? (typeof title === "string" ? title : undefined);
  return (
    <div className={cn("mb-6 flex flex-wrap items-end justify-between gap-4", className)}>
      {tabTitle ? <title>{`${tabTitle} · Coatwright`}</title> : null}
      <div className="min-w-0">
        {eyebrow ? <div className="mb-1 text-sm font-medium text-primer-700">{eyebrow}</div> : null}
        <h1 className="text-2xl font-bold tracking-tight text-ink-950 sm:text-3xl">{title}</h1>
        {description ? <div className="mt-1 max-w-prose text-sm text-primer-700 sm:text-base">{description}</div> : null}
      </div>
      {actions ? <div className="flex flex-wrap items-center gap-2">{actions}</div> : null}
    </div>
  );
}
