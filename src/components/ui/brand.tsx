import { cn } from "@/utils/cn";

/** Three stacked coats: Coatwright's mark. */
export function BrandMark({ className }: { className?: string }) {
  return (
    <svg viewBox="0 0 64 64" aria-hidden className={cn("size-8", className)}>
      <rect width="64" height="64" rx="14" fill="#0b1020" />
      <path d="M14 44c6-4 12-6 18-6s12 2 18 6" fill="none" stroke="#5f6a9c" strokeWidth="5" strokeLinecap="round" />
      <path d="M14 34c6-4 12-6 18-6s12 2 18 6" fill="none" stroke="#e8ad24" strokeWidth="5" strokeLinecap="round" />
      <path d="M14 24c6-4 12-6 18-6s12 2 18 6" fill="none" stroke="#f7508a" strokeWidth="5" strokeLinecap="round" />
    </svg>
  );
}

export function Brand({ className, tone = "light" }: { className?: string; tone?: "light" | "dark" }) {
  return (
    <span className={cn("inline-flex items-center gap-2.5", className)}>
      <BrandMark className={tone === "light" ? "ring-1 ring-white/15 rounded-[0.55rem]" : undefined} />
      <span className={cn("text-lg font-bold tracking-tight", tone === "light" ? "text-white" : "text-ink-950")}>Coatwright</span>
    </span>
  );
}
