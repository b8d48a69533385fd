import type { ReactNode } from "react";
import { cn } from "@/utils/cn";

export function FormActions({ children, className }: { children: ReactNode; className?: string }) {
  return <div className={cn("flex flex-wrap items-center gap-3 pt-2", className)}>{children}</div>;
}
