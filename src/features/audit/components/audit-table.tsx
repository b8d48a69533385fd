import { useId, useMemo, useState } from "react";
import { useQuery, type QueryKey } from "@tanstack/react-query";
import { FilterX, History } from "lucide-react";
import { AUDIT_KIND_LABELS, AUDIT_KINDS, type AuditKindName } from "@shared/schemas/audit.schema";
import { Button } from "@/components/ui/button";
import { DataTable } from "@/components/ui/data-table/data-table";
import { EmptyState } from "@/components/ui/empty-state";
import { Select } from "@/components/ui/form/select";
import { SearchPicker, type PickerQueryFor } from "@/components/ui/form/search-picker";
import { SearchInput } from "@/components/ui/search-input";
import { Spinner } from "@/components/ui/spinner";
import { controlClasses } from "@/components/ui/form/field";
import { useListSearchParams } from "@/hooks/use-list-search-params";
import { cn } from "@/utils/cn";
import { auditQueries, type AuditListParams } from "../api/audit.queries";
import { auditColumns } from "./audit-columns";

const DATE = /^\d{4}-\d{2}-\d{2}$/;

/** The audit trail, newest first: filters and page live in the URL (?who=&kind=&from=&to=&q=&page=&pageSize=). */
export function AuditTable<K extends QueryKey>({ peopleSearch, whoName }: { peopleSearch: PickerQueryFor<K>; whoName: string | null }) {
  const ids = { kind: useId(), from: useId(), to: useId() };
  const [picked, setPicked] = useState<{ id: string; name: string } | null>(null);
  const params = useListSearchParams({ sortFields: ["at"] as const, defaultSort: "-at" });
  const sp = params.searchParams;
  const kindParam = sp.get("kind") ?? "";
  const kind = (AUDIT_KINDS as readonly string[]).includes(kindParam) ? (kindParam as AuditKindName) : undefined;
  const who = sp.get("who") ?? "";
  const from = DATE.test(sp.get("from") ?? "") ? sp.get("from")! : "";
  const to = DATE.test(sp.get("to") ?? "") ? sp.get("to")! : "";
  const backwards = Boolean(from && to && from > to);

  const query: AuditListParams = useMemo(
    () => ({
      page: params.page,
      pageSize: params.pageSize,
      ...(params.q ? { q: params.q } : {}),
      ...(kind ? { kind } : {}),
      ...(who ? { userId: who } : {}),
      ...(from ? { from } : {}),
      ...(to ? { to } : {}),
    }),
    [params.page, params.pageSize, params.q, kind, who, from, to],
  );
  const { data, isPending, isPlaceholderData, isFetching, error } = useQuery({ ...auditQueries.list(query), enabled: !backwards });
  const filtered = Boolean(params.q || kind || who || from || to);

  return (
    <>
      <div className="mb-4 flex flex-col gap-4 rounded-xl border border-primer-200 bg-white p-4 shadow-card">
        <div className="flex flex-wrap items-end gap-3">
          <SearchInput
            label="Search the trail"
            value={params.q}
            onSearch={(q) => params.update({ q }, { replace: true })}
            placeholder="What, action, name or record number"
            className="min-w-[14rem] flex-1"
          />
          <SearchPicker
            label="Who"
            noun="people"
            emptyLabel="Anyone"
            placeholder="Anyone"
            value={who}
            valueName={who ? (picked?.id === who ? picked.name : (whoName ?? "…")) : null}
            onChange={(id, name) => {
              setPicked(name ? { id, name } : null);
              params.update({ who: id });
            }}
            queryFor={peopleSearch}
            className="min-w-[14rem]"
          />
          <div className="flex min-w-[11rem] flex-col gap-1.5">
            <label htmlFor={ids.kind} className="text-sm font-semibold text-ink-950">
              Kind of change
            </label>
            <Select id={ids.kind} value={kind ?? ""} onChange={(e) => params.update({ kind: e.target.value })}>
              <option value="">All kinds</option>
              {AUDIT_KINDS.map((k) => (
                <option key={k} value={k}>
                  {AUDIT_KIND_LABELS[k]}
                </option>
              ))}
            </Select>
          </div>
          <div className="flex flex-col gap-1.5">
            <label htmlFor={ids.from} className="text-sm font-semibold text-ink-950">
              From date
            </label>
            <input id={ids.from} type="date" value={from} onChange={(e) => params.update({ from: e.target.value })} className={cn(controlClasses, "w-auto")} />
          </div>
          <div className="flex flex-col gap-1.5">
            <label htmlFor={ids.to} className="text-sm font-semibold text-ink-950">
              To date
            </label>
            <input
              id={ids.to}
              type="date"
              value={to}
              onChange={(e) => params.update({ to: e.target.value })}
              className={cn(controlClasses, "w-auto")}
              aria-invalid={backwards || undefined}
              aria-describedby={backwards ? `${ids.to}-error` : undefined}
            />
          </div>
          {filtered ? (
            <Button variant="ghost" onClick={() => params.update({ q: null, kind: null, who: null, from: null, to: null })} icon={<FilterX aria-hidden className="size-4" />}>
              Reset filters
            </Button>
          ) : null}
        </div>
        {backwards ? (
          <p id={`${ids.to}-error`} className="text-sm font-medium text-red-800">
            The end date must not be before the start date.
          </p>
        ) : null}
      </div>
      {backwards ? null : isPending ? (
        <Spinner label="Loading the audit trail…" />
      ) : error && !data ? (
        <p role="alert" className="text-red-800">{error.message}</p>
      ) : (
        <DataTable
          label="Audit trail"
          columns={auditColumns}
          data={data?.items ?? []}
          getRowId={(e) => String(e.id)}
          isFetching={isPlaceholderData && isFetching}
          minWidthClassName="min-w-[52rem]"
          pagination={{
            page: params.page,
            pageSize: params.pageSize,
            total: data?.total ?? 0,
            noun: "entries",
            onPageChange: (page) => params.update({ page: page > 1 ? page : null }),
            onPageSizeChange: (pageSize) => params.update({ pageSize }),
          }}
          empty={<EmptyState icon={<History aria-hidden />} title={filtered ? "No entries match these filters" : "Nothing recorded yet"} className="border-0" />}
        />
      )}
    </>
  );
}
