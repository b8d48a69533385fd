import { ROLE_LABELS, type Role } from "@shared/domain/roles";
import { cn } from "@/utils/cn";

const TONES: Record<Role, string> = {
  owner: "bg-ink-900 text-white",
  estimator: "bg-ink-100 text-ink-900",
  painter: "bg-candy-50 text-candy-800 ring-1 ring-inset ring-candy-200",
  customer: "bg-primer-100 text-primer-800",
};

export function RoleBadge({ role, className }: { role: Role; className?: string }) {
  return <span className={cn("inline-flex rounded-full px-2.5 py-0.5 text-xs font-semibold", TONES[role], className)}>{ROLE_LABELS[role]}</span>;
}
