import { createColumnHelper } from "@tanstack/react-table";
import { Pencil, Power, PowerOff } from "lucide-react";
import type { UserDto } from "@shared/schemas/user.schema";
import { Button } from "@/components/ui/button";
import { formatDay } from "@/utils/format-date";
import { RoleBadge } from "./role-badge";

const column = createColumnHelper<UserDto>();

type Actions = {
  currentUserId: string;
  onEdit: (user: UserDto) => void;
  onToggleActive: (user: UserDto) => void;
};

/** Column ids match the API's user sort fields: name, email, role, createdAt. */
export function usersColumns({ currentUserId, onEdit, onToggleActive }: Actions) {
  return [
    column.accessor("name", {
      id: "name",
      header: "Name",
      cell: (info) => (
        <span className="font-semibold text-ink-950">
          {info.getValue()}
          {info.row.original.id === currentUserId ? <span className="ml-1.5 text-xs font-medium text-primer-700">(you)</span> : null}
        </span>
      ),
      meta: { rowHeader: true },
    }),
    column.accessor("email", { id: "email", header: "Email" }),
    column.accessor("role", {
      id: "role",
      header: "Role",
      cell: (info) => (
        <span className="flex flex-col items-start gap-0.5">
          <RoleBadge role={info.getValue()} />
          {info.row.original.customerName ? <span className="text-xs text-primer-700">for {info.row.original.customerName}</span> : null}
        </span>
      ),
    }),
    column.accessor("active", {
      id: "active",
      header: "Status",
      enableSorting: false,
      cell: (info) =>
        info.getValue() ? (
          <span className="font-medium text-emerald-800">Active</span>
        ) : (
          <span className="font-medium text-primer-700">Switched off</span>
        ),
    }),
    column.accessor("createdAt", {
      id: "createdAt",
      header: "Added",
      sortDescFirst: true,
      cell: (info) => <span className="whitespace-nowrap text-primer-700">{formatDay(info.getValue())}</span>,
      meta: { className: "hidden lg:table-cell" },
    }),
    column.display({
      id: "actions",
      header: () => <span className="sr-only">Actions</span>,
      cell: ({ row }) => {
        const user = row.original;
        const self = user.id === currentUserId;
        return (
          <div className="flex justify-end gap-1 whitespace-nowrap">
            <Button variant="ghost" size="sm" onClick={() => onEdit(user)} icon={<Pencil aria-hidden className="size-4" />}>
              Edit<span className="sr-only"> {user.name}</span>
            </Button>
            {!self ? (
              <Button
                variant="ghost"
                size="sm"
                onClick={() => onToggleActive(user)}
                icon={user.active ? <PowerOff aria-hidden className="size-4" /> : <Power aria-hidden className="size-4" />}
              >
                {user.active ? "Deactivate" : "Reactivate"}
                <span className="sr-only"> {user.name}</span>
              </Button>
            ) : null}
          </div>
        );
      },
      meta: { className: "text-right" },
    }),
  ];
}
