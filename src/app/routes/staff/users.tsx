import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { UserPlus } from "lucide-react";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { PageHeader } from "@/components/ui/page-header";
import { Spinner } from "@/components/ui/spinner";
import { toast } from "@/components/ui/toast/toast-store";
import { AccessGate } from "@/features/auth/components/access-gate";
import { useCurrentUser } from "@/features/auth/hooks/use-current-user";
import { customerQueries } from "@/features/customers/api/customers.queries";
import { useCreateUser } from "@/features/users/api/users.queries";
import { CreateUserForm } from "@/features/users/components/create-user-form";
import { UsersTable } from "@/features/users/components/users-table";

export default function UsersRoute() {
  return (
    <AccessGate access="owner">
      <UsersPage />
    </AccessGate>
  );
}

function UsersPage() {
  const user = useCurrentUser();
  const customers = useQuery(customerQueries.options());
  const [creating, setCreating] = useState(false);
  return (
    <>
      <PageHeader
        title="Users"
        description="Who can sign in, and what each of them can see."
        actions={
          <Button onClick={() => setCreating(true)} icon={<UserPlus aria-hidden className="size-5" />}>
            New user
          </Button>
        }
      />
      <UsersTable currentUserId={user.id} customers={customers.data?.options ?? []} />
      {creating ? <CreateUserDialog customers={customers.data?.options} loading={customers.isPending} onClose={() => setCreating(false)} /> : null}
    </>
  );
}

function CreateUserDialog({
  customers,
  loading,
  onClose,
}: {
  customers: { id: number; name: string }[] | undefined;
  loading: boolean;
  onClose: () => void;
}) {
  const create = useCreateUser();
  return (
    <Dialog title="New user" description="They sign in with this email and the first password you set." onClose={onClose}>
      {loading ? (
        <Spinner />
      ) : (
        <CreateUserForm
          customers={customers ?? []}
          onCancel={onClose}
          onSubmit={async (values) => {
            const created = await create.mutateAsync(values);
            toast.success(`${created.name} can now sign in`);
            onClose();
          }}
        />
      )}
    </Dialog>
  );
}
