import { useId, useMemo, useState } from "react";
import { useQuery } from "@tanstack/react-query";
import type { SortingState, Updater } from "@tanstack/react-table";
import { Users } from "lucide-react";
import { ROLE_LABELS, ROLES, type Role } from "@shared/domain/roles";
import type { UserDto } from "@shared/schemas/user.schema";
import { DataTable } from "@/components/ui/data-table/data-table";
import { Dialog } from "@/components/ui/dialog";
import { EmptyState } from "@/components/ui/empty-state";
import { Select } from "@/components/ui/form/select";
import { SearchInput } from "@/components/ui/search-input";
import { Spinner } from "@/components/ui/spinner";
import { toast } from "@/components/ui/toast/toast-store";
import { sortingToSort, sortToSorting, useListSearchParams } from "@/hooks/use-list-search-params";
import { userQueries, useUpdateUser, type UserSortField } from "../api/users.queries";
import { EditUserForm } from "./edit-user-form";
import { usersColumns } from "./users-columns";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";

const SORT_FIELDS: readonly UserSortField[] = ["name", "email", "role", "createdAt"];

type Action = { kind: "edit"; user: UserDto } | { kind: "toggle"; user: UserDto } | null;

/** Everyone who can sign in, with search, a role filter and sorting in the URL; edit and switch accounts on/off. */
export function UsersTable({ currentUserId, customers }: { currentUserId: string; customers: { id: number; name: string }[] }) {
  const roleSelectId = useId();
  const params = useListSearchParams({ sortFields: SORT_FIELDS, defaultSort: "name" });
  const roleParam = params.searchParams.get("role") ?? "";
  const role = (ROLES as readonly string[]).includes(roleParam) ? (roleParam as Role) : undefined;
  const query = { page: params.page, pageSize: params.pageSize, sort: params.sort, ...(params.q ? { q: params.q } : {}), ...(role ? { role } : {}) };
  const { data, isPending, isPlaceholderData, isFetching } = useQuery(userQueries.list(query));
  const [action, setAction] = useState<Action>(null);

  const sorting = sortToSorting(params.sort);
  const onSortingChange = (updater: Updater<SortingState>) =>
    params.update({ sort: sortingToSort(typeof updater === "function" ? updater(sorting) : updater) });
  const columns = useMemo(
    () =>
      usersColumns({
        currentUserId,
        onEdit: (user) => setAction({ kind: "edit", user }),
        onToggleActive: (user) => setAction({ kind: "toggle", user }),
      }),
    [currentUserId],
  );

  return (
    <>
      <div className="mb-4 flex flex-wrap items-end gap-4">
        <SearchInput
          label="Search users"
          value={params.q}
          onSearch={(q) => params.update({ q }, { replace: true })}
          placeholder="Name or email"
          className="min-w-[16rem] flex-1 sm:max-w-md"
        />
        <div className="flex min-w-[11rem] flex-col gap-1.5">
          <label htmlFor={roleSelectId} className="text-sm font-semibold text-ink-950">
            Role filter
          </label>
          <Select id={roleSelectId} value={role ?? ""} onChange={(e) => params.update({ role: e.target.value })}>
            <option value="">All roles</option>
            {ROLES.map((r) => (
              <option key={r} value={r}>
                {ROLE_LABELS[r]}
              </option>
            ))}
          </Select>
        </div>
      </div>
      {isPending ? (
        <Spinner label="Loading users…" />
      ) : (
        <DataTable
          label="Users"
          columns={columns}
          data={data?.items ?? []}
          getRowId={(u) => u.id}
          sorting={sorting}
          onSortingChange={onSortingChange}
          isFetching={isPlaceholderData && isFetching}
          pagination={{
            page: params.page,
            pageSize: params.pageSize,
            total: data?.total ?? 0,
            noun: "users",
            onPageChange: (page) => params.update({ page: page > 1 ? page : null }),
            onPageSizeChange: (pageSize) => params.update({ pageSize }),
          }}
          empty={<EmptyState icon={<Users aria-hidden />} title="No users match" className="border-0" />}
        />
      )}
      {action?.kind === "edit" ? (
        <EditUserDialog user={action.user} customers={customers} isSelf={action.user.id === currentUserId} onClose={() => setAction(null)} />
      ) : null}
      {action?.kind === "toggle" ? <ToggleActiveDialog user={action.user} onClose={() => setAction(null)} /> : null}
    </>
  );
}

function EditUserDialog({
  user,
  customers,
  isSelf,
  onClose,
}: {
  user: UserDto;
  customers: { id: number; name: string }[];
  isSelf: boolean;
  onClose: () => void;
}) {
  const update = useUpdateUser();
  return (
    <Dialog title={`Edit ${user.name}`} description={user.email} onClose={onClose}>
      <EditUserForm
        user={user}
        customers={customers}
        isSelf={isSelf}
        onCancel={onClose}
        onSubmit={async (values) => {
          await update.mutateAsync({ id: user.id, ...values, version: user.version });
          toast.success(`Saved ${values.name ?? user.name}`);
          onClose();
        }}
      />
    </Dialog>
  );
}

function ToggleActiveDialog({ user, onClose }: { user: UserDto; onClose: () => void }) {
  const update = useUpdateUser();
  const switchingOff = user.active;
  return (
    <ConfirmDialog
      title={switchingOff ? `Deactivate ${user.name}?` : `Reactivate ${user.name}?`}
      description={user.email}
      confirmLabel={switchingOff ? "Deactivate" : "Reactivate"}
      keepLabel="Cancel"
      tone={switchingOff ? "danger" : "primary"}
      pending={update.isPending}
      failure="That did not work. Try again."
      onConfirm={async () => {
        await update.mutateAsync({ id: user.id, active: !switchingOff, version: user.version });
        return switchingOff ? `${user.name} is switched off` : `${user.name} can sign in again`;
      }}
      onClose={onClose}
    >
      {switchingOff ? "They are signed out everywhere and cannot sign in until reactivated. Their history stays." : "They can sign in again with their existing password."}
    </ConfirmDialog>
  );
}
