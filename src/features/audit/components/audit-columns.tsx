import { createColumnHelper } from "@tanstack/react-table";
import { AUDIT_KIND_LABELS, type AuditEntryDto, type AuditKindName } from "@shared/schemas/audit.schema";
import { formatDateTime } from "@/utils/format-date";
import { auditSubject } from "../audit-words";
import { AuditChange } from "./audit-change";

const column = createColumnHelper<AuditEntryDto>();

const kindLabel = (kind: string) => AUDIT_KIND_LABELS[kind as AuditKindName] ?? kind;

export const auditColumns = [
  column.accessor("at", {
    id: "at",
    header: "When",
    enableSorting: false,
    cell: (info) => <span className="whitespace-nowrap">{formatDateTime(info.getValue())}</span>,
    meta: { className: "align-top" },
  }),
  column.accessor("userName", {
    id: "who",
    header: "Who",
    enableSorting: false,
    cell: (info) => (
      <span className="flex flex-col">
        <span className="font-semibold text-ink-950">{info.getValue() ?? "The system"}</span>
        <span className="text-xs text-primer-700">{info.row.original.address ? `from ${info.row.original.address}` : "no address"}</span>
      </span>
    ),
    meta: { className: "align-top", rowHeader: true },
  }),
  column.display({
    id: "what",
    header: "What",
    cell: ({ row }) => {
      const e = row.original;
      return (
        <span className="flex flex-col">
          <span className="font-semibold text-ink-950">{auditSubject(e)}</span>
          <span className="text-xs text-primer-700">{kindLabel(e.kind)}</span>
        </span>
      );
    },
    meta: { className: "align-top" },
  }),
  column.display({
    id: "change",
    header: "Before → after",
    cell: ({ row }) => <AuditChange before={row.original.before} after={row.original.after} />,
    meta: { className: "align-top min-w-[18rem]" },
  }),
];
