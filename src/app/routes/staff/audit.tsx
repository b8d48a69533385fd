import { useQuery } from "@tanstack/react-query";
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
  // Everyone who could appear in the trail (the "who" filter); 100 is the API page limit.
  const users = useQuery(userQueries.list({ page: 1, pageSize: 100, sort: "name" }));
  const people = (users.data?.items ?? []).map((u) => ({ id: u.id, name: u.name }));
  return (
    <>
      <PageHeader
        title="Audit trail"
        description="Every change to money, finish plans, users and roles, and settings: who, when, from which address, and what it was before. Entries cannot be edited or removed."
      />
      <AuditTable people={people} />
    </>
  );
}
