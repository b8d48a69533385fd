import { useQuery } from "@tanstack/react-query";
import { useSearchParams } from "react-router";
import { PageHeader } from "@/components/ui/page-header";
import { AccessGate } from "@/features/auth/components/access-gate";
import { AuditTable } from "@/features/audit/components/audit-table";
import { userQueries } from "@/features/users/api/users.queries";

export default function AuditRoute() {
  return (
    <AccessGate access="owner">
      <AuditPage />
    </AccessGate>
  );
}

function AuditPage() {
  // The "who" filter searches people on the server; the chosen one's name comes from their record.
  const who = useSearchParams()[0].get("who") ?? "";
  const person = useQuery({ ...userQueries.detail(who), enabled: Boolean(who) });
  return (
    <>
      <PageHeader
        title="Audit trail"
        description="Every change to money, finish plans, users and roles, and settings: who, when, from which address, and what it was before. Entries cannot be edited or removed."
      />
      <AuditTable peopleSearch={userQueries.search} whoName={person.data?.name ?? (person.isError ? "Unknown person" : null)} />
    </>
  );
}
