import type { ComponentProps } from "react";
import { ChevronDown } from "lucide-react";
import { cn } from "@/utils/cn";
import { controlClasses } from "./field";

/** A native <select> in the app's style (native keeps it usable with screen readers and on touch). */
export function Select({ className, children, ...select }: ComponentProps<"select">) {
  return (
    <div className="relative">
      <select {...select} className={cn(controlClasses, "appearance-none pr-10", className)}>
        {children}
      </select>
      <ChevronDown aria-hidden className="pointer-events-none absolute top-1/2 right-3 size-5 -translate-y-1/2 text-primer-600" />
    </div>
  );
}
