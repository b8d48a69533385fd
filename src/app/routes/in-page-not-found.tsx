import type { ReactNode } from "react";
import { SearchX } from "lucide-react";
import { ButtonLink } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";

/** A record that does not exist (or is not yours): said plainly inside the app frame. */
export function InPageNotFound({ what, backTo, backLabel }: { what: string; backTo: string; backLabel: ReactNode }) {
  return (
    <>
      <PageHeader title={`${what} not found`} />
      <EmptyState icon={<SearchX aria-hidden />} title={`This ${what.toLowerCase()} does not exist, or is not open to you.`} action={<ButtonLink to={backTo}>{backLabel}</ButtonLink>} />
    </>
  );
}
