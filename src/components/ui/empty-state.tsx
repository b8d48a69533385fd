import type { ReactNode } from "react";
import { cn } from "@/utils/cn";

export function EmptyState({
  title,
  children,
  action,
  icon,
  className,
}: {
  title: string;
  children?: ReactNode;
  action?: ReactNode;
  icon?: ReactNode;
  className?: string;
}) {
  return (
    <div className={cn("flex flex-col items-center gap-3 rounded-xl border border-dashed border-primer-300 bg-white px-6 py-10 text-center", className)}>
      {icon ? <div className="text-primer-500 [&_svg]:size-8">{icon}</div> : null}
      <p className="text-base font-semibold text-ink-950">{title}</p>
      {children ? <div className="max-w-prose text-sm text-primer-700">{children}</div> : null}
      {action}
    </div>
  );
}
