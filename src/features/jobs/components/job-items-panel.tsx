import { useState } from "react";
import { Layers, Pencil, Plus, Trash2 } from "lucide-react";
import { needsAdhesionPromoter, SUBSTRATE_LABELS, type Substrate } from "@shared/domain/substrates";
import type { JobItemDto } from "@shared/schemas/job.schema";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { EmptyState } from "@/components/ui/empty-state";
import { Panel } from "@/components/ui/panel";
import { toast } from "@/components/ui/toast/toast-store";
import { useCreateJobItem, useDeleteJobItem, useUpdateJobItem } from "../api/job-items.queries";
import { formatArea } from "./item-area";
import { JobItemForm } from "./job-item-form";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";

const substrateLabel = (s: string) => SUBSTRATE_LABELS[s as Substrate] ?? s;

type Editing = { mode: "add" } | { mode: "edit"; item: JobItemDto } | { mode: "delete"; item: JobItemDto } | null;

/** The parts of a job; the office can add, change and remove them. */
export function JobItemsPanel({ jobId, items, canEdit }: { jobId: number; items: JobItemDto[]; canEdit: boolean }) {
  const [editing, setEditing] = useState<Editing>(null);
  const close = () => setEditing(null);
  const totalBy = items.reduce<Record<string, number>>((acc, i) => ({ ...acc, [i.areaUnit]: (acc[i.areaUnit] ?? 0) + i.surfaceArea }), {});

  return (
    <Panel
      title="Items"
      titleId="job-items-heading"
      actions={
        canEdit ? (
          <Button variant="secondary" onClick={() => setEditing({ mode: "add" })} icon={<Plus aria-hidden className="size-4" />}>
            Add item
          </Button>
        ) : null
      }
      flush
    >
      {items.length === 0 ? (
        <div className="p-4">
          <EmptyState icon={<Layers aria-hidden />} title="No items yet" className="border-0">
            {canEdit ? "Add each part to be painted, with its substrate and surface area." : "The shop has not listed the parts yet."}
          </EmptyState>
        </div>
      ) : (
        <div className="scrollbar-thin relative overflow-x-auto">
          <table className="w-full text-left text-sm" aria-labelledby="job-items-heading">
            <thead className="bg-primer-100">
              <tr>
                <th scope="col" className="px-4 py-2 font-semibold">Item</th>
                <th scope="col" className="px-4 py-2 font-semibold">Substrate</th>
                <th scope="col" className="px-4 py-2 text-right font-semibold">Area</th>
                {canEdit ? (
                  <th scope="col" className="px-4 py-2 text-right font-semibold">
                    <span className="sr-only">Actions</span>
                  </th>
                ) : null}
              </tr>
            </thead>
            <tbody>
              {items.map((item) => (
                <tr key={item.id} className="border-t border-primer-100 align-top">
                  <th scope="row" className="px-3 py-3 font-semibold text-ink-950 sm:px-4">
                    {item.name}
                    {item.notes ? <p className="mt-0.5 font-normal text-primer-700">{item.notes}</p> : null}
                  </th>
                  <td className="px-4 py-3">
                    {substrateLabel(item.substrate)}
                    {needsAdhesionPromoter(item.substrate as Substrate) ? (
                      <p className="mt-0.5 text-xs font-medium text-flake-800">Bare plastic: adhesion promoter before sealer</p>
                    ) : null}
                  </td>
                  <td className="px-4 py-3 text-right whitespace-nowrap tabular-nums">{formatArea(item.surfaceArea, item.areaUnit)}</td>
                  {canEdit ? (
                    <td className="px-2 py-1.5 text-right whitespace-nowrap">
                      <Button variant="ghost" size="sm" onClick={() => setEditing({ mode: "edit", item })} icon={<Pencil aria-hidden className="size-4" />}>
                        <span className="sr-only sm:not-sr-only">Edit</span>
                        <span className="sr-only"> {item.name}</span>
                      </Button>
                      <Button variant="ghost" size="sm" onClick={() => setEditing({ mode: "delete", item })} icon={<Trash2 aria-hidden className="size-4" />}>
                        <span className="sr-only sm:not-sr-only">Delete</span>
                        <span className="sr-only"> {item.name}</span>
                      </Button>
                    </td>
                  ) : null}
                </tr>
              ))}
            </tbody>
            <tfoot>
              <tr className="border-t border-primer-200 bg-primer-50">
                <th scope="row" colSpan={2} className="px-4 py-2 text-right font-semibold">
                  Total area
                </th>
                <td className="px-4 py-2 text-right font-semibold whitespace-nowrap tabular-nums">
                  {Object.entries(totalBy)
                    .map(([unit, sum]) => formatArea(sum, unit as "m2" | "ft2"))
                    .join(" + ")}
                </td>
                {canEdit ? <td /> : null}
              </tr>
            </tfoot>
          </table>
        </div>
      )}
      {editing?.mode === "add" ? <AddItemDialog jobId={jobId} onClose={close} /> : null}
      {editing?.mode === "edit" ? <EditItemDialog jobId={jobId} item={editing.item} onClose={close} /> : null}
      {editing?.mode === "delete" ? <DeleteItemDialog jobId={jobId} item={editing.item} onClose={close} /> : null}
    </Panel>
  );
}

function AddItemDialog({ jobId, onClose }: { jobId: number; onClose: () => void }) {
  const create = useCreateJobItem(jobId);
  return (
    <Dialog title="Add item" onClose={onClose}>
      <JobItemForm
        submitLabel="Add item"
        onCancel={onClose}
        onSubmit={async (values) => {
          await create.mutateAsync(values);
          toast.success(`Added ${values.name}`);
          onClose();
        }}
      />
    </Dialog>
  );
}

function EditItemDialog({ jobId, item, onClose }: { jobId: number; item: JobItemDto; onClose: () => void }) {
  const update = useUpdateJobItem(jobId);
  return (
    <Dialog title={`Edit ${item.name}`} onClose={onClose}>
      <JobItemForm
        submitLabel="Save item"
        defaultValues={{
          name: item.name,
          substrate: item.substrate as Substrate,
          surfaceArea: item.surfaceArea,
          areaUnit: item.areaUnit,
          notes: item.notes ?? "",
        }}
        onCancel={onClose}
        onSubmit={async (values) => {
          await update.mutateAsync({ itemId: item.id, ...values, version: item.version });
          toast.success(`Saved ${values.name}`);
          onClose();
        }}
      />
    </Dialog>
  );
}

function DeleteItemDialog({ jobId, item, onClose }: { jobId: number; item: JobItemDto; onClose: () => void }) {
  const remove = useDeleteJobItem(jobId);
  return (
    <ConfirmDialog
      title={`Delete ${item.name}?`}
      confirmLabel="Delete item"
      keepLabel="Keep it"
      pending={remove.isPending}
      failure="The item could not be deleted."
      onConfirm={async () => {
        await remove.mutateAsync(item.id);
        return `Deleted ${item.name}`;
      }}
      onClose={onClose}
    >
      The item and its notes are removed from this job.
    </ConfirmDialog>
  );
}
