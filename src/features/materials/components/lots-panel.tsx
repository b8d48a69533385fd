import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { Boxes, Pencil, Plus, Trash2 } from "lucide-react";
import { createLotInputSchema, type CreateLotInput, type LotDto } from "@shared/schemas/material.schema";
import type { PurchaseUnit } from "@shared/domain/materials";
import type { z } from "zod";
import { applyServerErrors } from "@/lib/form-errors";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { EmptyState } from "@/components/ui/empty-state";
import { FormActions } from "@/components/ui/form/form-actions";
import { TextField } from "@/components/ui/form/text-field";
import { Panel } from "@/components/ui/panel";
import { toast } from "@/components/ui/toast/toast-store";
import { formatDate } from "@/utils/format-date";
import { formatAmount, unitSymbol } from "@/utils/format-quantity";
import { useCreateLot, useDeleteLot, useUpdateLot } from "../api/materials.queries";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";

type Editing = { mode: "add" } | { mode: "edit"; lot: LotDto } | { mode: "delete"; lot: LotDto } | null;

/** Stock by lot, in the material's purchase unit; the office adds lots and corrects counts. */
export function LotsPanel({ materialId, unit, lots, canEdit }: { materialId: number; unit: PurchaseUnit; lots: LotDto[]; canEdit: boolean }) {
  const [editing, setEditing] = useState<Editing>(null);
  const close = () => setEditing(null);
  const total = lots.reduce((a, l) => a + l.quantityOnHand, 0);
  return (
    <Panel
      title="Stock by lot"
      titleId="lots-heading"
      flush
      actions={
        canEdit ? (
          <Button variant="secondary" onClick={() => setEditing({ mode: "add" })} icon={<Plus aria-hidden className="size-4" />}>
            Add lot
          </Button>
        ) : null
      }
    >
      {lots.length === 0 ? (
        <div className="p-4">
          <EmptyState icon={<Boxes aria-hidden />} title="No stock recorded" className="border-0">
            {canEdit ? "Add a lot when the delivery comes in." : "The office has not recorded any lots."}
          </EmptyState>
        </div>
      ) : (
        <div className="scrollbar-thin overflow-x-auto">
          <table className="w-full min-w-[32rem] text-left text-sm" aria-labelledby="lots-heading">
            <thead className="bg-primer-100">
              <tr>
                <th scope="col" className="px-4 py-2 font-semibold">Lot</th>
                <th scope="col" className="px-4 py-2 text-right font-semibold">On hand</th>
                <th scope="col" className="px-4 py-2 font-semibold">Received</th>
                <th scope="col" className="px-4 py-2 font-semibold">Expires</th>
                {canEdit ? (
                  <th scope="col" className="px-4 py-2">
                    <span className="sr-only">Actions</span>
                  </th>
                ) : null}
              </tr>
            </thead>
            <tbody>
              {lots.map((lot) => (
                <tr key={lot.id} className="border-t border-primer-100">
                  <th scope="row" className="px-4 py-2.5 font-mono text-sm font-semibold whitespace-nowrap">{lot.lotNumber}</th>
                  <td className="px-4 py-2.5 text-right tabular-nums" data-testid={`lot-qty-${lot.lotNumber}`}>
                    {formatAmount(lot.quantityOnHand, unit, 3)}
                  </td>
                  <td className="px-4 py-2.5 whitespace-nowrap">{formatDate(lot.receivedOn) || "—"}</td>
                  <td className="px-4 py-2.5">
                    {formatDate(lot.expiresOn) || "—"}
                    {lot.expired ? <span className="ml-2 rounded bg-red-100 px-1.5 py-0.5 text-xs font-semibold text-red-900">Expired</span> : null}
                  </td>
                  {canEdit ? (
                    <td className="px-2 py-1.5 text-right whitespace-nowrap">
                      <Button variant="ghost" size="sm" onClick={() => setEditing({ mode: "edit", lot })} icon={<Pencil aria-hidden className="size-4" />}>
                        Edit<span className="sr-only"> lot {lot.lotNumber}</span>
                      </Button>
                      <Button variant="ghost" size="sm" onClick={() => setEditing({ mode: "delete", lot })} icon={<Trash2 aria-hidden className="size-4" />}>
                        Remove<span className="sr-only"> lot {lot.lotNumber}</span>
                      </Button>
                    </td>
                  ) : null}
                </tr>
              ))}
            </tbody>
            <tfoot>
              <tr className="border-t border-primer-200 bg-primer-50">
                <th scope="row" className="px-4 py-2 text-right font-semibold">Total</th>
                <td className="px-4 py-2 text-right font-semibold tabular-nums">{formatAmount(total, unit, 3)}</td>
                <td colSpan={canEdit ? 3 : 2} />
              </tr>
            </tfoot>
          </table>
        </div>
      )}
      {editing?.mode === "add" ? <LotDialog materialId={materialId} unit={unit} onClose={close} /> : null}
      {editing?.mode === "edit" ? <LotDialog materialId={materialId} unit={unit} lot={editing.lot} onClose={close} /> : null}
      {editing?.mode === "delete" ? <RemoveLotDialog materialId={materialId} lot={editing.lot} onClose={close} /> : null}
    </Panel>
  );
}

const LOT_FIELDS = ["lotNumber", "quantityOnHand", "receivedOn", "expiresOn"] as const;

function LotDialog({ materialId, unit, lot, onClose }: { materialId: number; unit: PurchaseUnit; lot?: LotDto; onClose: () => void }) {
  const create = useCreateLot(materialId);
  const update = useUpdateLot(materialId);
  const [problem, setProblem] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<CreateLotInput, unknown, z.output<typeof createLotInputSchema>>({
    resolver: zodResolver(createLotInputSchema),
    defaultValues: lot
      ? { lotNumber: lot.lotNumber, quantityOnHand: String(lot.quantityOnHand), receivedOn: lot.receivedOn ?? "", expiresOn: lot.expiresOn ?? "" }
      : { lotNumber: "", quantityOnHand: "", receivedOn: new Date().toISOString().slice(0, 10), expiresOn: "" },
  });
  const submit = handleSubmit(async (values) => {
    setProblem(null);
    try {
      if (lot) await update.mutateAsync({ lotId: lot.id, ...values, version: lot.version });
      else await create.mutateAsync(values);
      toast.success(lot ? `Saved lot ${values.lotNumber}` : `Added lot ${values.lotNumber}`);
      onClose();
    } catch (error) {
      setProblem(applyServerErrors(error, setError, LOT_FIELDS));
    }
  });
  return (
    <Dialog title={lot ? `Lot ${lot.lotNumber}` : "Add a lot"} description={lot ? "Correct the count after a stocktake, or fix a date." : undefined} onClose={onClose}>
      <form onSubmit={submit} noValidate className="flex flex-col gap-5">
        {problem ? <Alert tone="error">{problem}</Alert> : null}
        <TextField label="Lot number" required autoComplete="off" error={errors.lotNumber?.message} {...register("lotNumber")} />
        <TextField label={`Quantity on hand (${unitSymbol(unit)})`} required inputMode="decimal" autoComplete="off" error={errors.quantityOnHand?.message} {...register("quantityOnHand")} />
        <div className="grid gap-5 sm:grid-cols-2">
          <TextField label="Received" type="date" error={errors.receivedOn?.message} {...register("receivedOn")} />
          <TextField label="Expires" type="date" error={errors.expiresOn?.message} {...register("expiresOn")} />
        </div>
        <FormActions>
          <Button type="submit" size="lg" pending={isSubmitting}>
            {lot ? "Save lot" : "Add lot"}
          </Button>
          <Button variant="ghost" size="lg" onClick={onClose}>
            Cancel
          </Button>
        </FormActions>
      </form>
    </Dialog>
  );
}

function RemoveLotDialog({ materialId, lot, onClose }: { materialId: number; lot: LotDto; onClose: () => void }) {
  const remove = useDeleteLot(materialId);
  return (
    <ConfirmDialog
      title={`Remove lot ${lot.lotNumber}?`}
      confirmLabel="Remove lot"
      keepLabel="Keep it"
      pending={remove.isPending}
      failure="The lot could not be removed."
      onConfirm={async () => {
        await remove.mutateAsync(lot.id);
        return `Removed lot ${lot.lotNumber}`;
      }}
      onClose={onClose}
    >
      Batches already mixed from this lot keep its number on their records.
    </ConfirmDialog>
  );
}
