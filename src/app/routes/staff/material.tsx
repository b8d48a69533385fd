import { formatMinutes } from "@shared/domain/duration";
import { useState, type ReactNode } from "react";
import { useNavigate } from "react-router";
import { useQuery } from "@tanstack/react-query";
import { Pencil, Trash2 } from "lucide-react";
import { roleCan } from "@shared/domain/roles";
import { MATERIAL_CATEGORY_LABELS } from "@shared/domain/materials";
import { centsToInput, formatCents } from "@shared/quote/money";
import type { MaterialDetailDto } from "@shared/schemas/material.schema";
import { isApiError } from "@/lib/api-client";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { PageHeader } from "@/components/ui/page-header";
import { Panel } from "@/components/ui/panel";
import { SafetyCautions } from "@/components/ui/safety-cautions";
import { Spinner } from "@/components/ui/spinner";
import { toast } from "@/components/ui/toast/toast-store";
import { paths } from "@/config/paths";
import { formatAmount, formatNumber } from "@/utils/format-quantity";
import { PURCHASE_UNIT_NAMES } from "@shared/domain/material-units";
import { useCurrentUser } from "@/features/auth/hooks/use-current-user";
import { materialQueries, useDeleteMaterial, useUpdateMaterial } from "@/features/materials/api/materials.queries";
import { DataSheetsPanel } from "@/features/materials/components/data-sheets-panel";
import { LotsPanel } from "@/features/materials/components/lots-panel";
import { MaterialForm } from "@/features/materials/components/material-form";
import { HazardIcons } from "@/features/materials/components/materials-catalogue";
import { InPageNotFound } from "../in-page-not-found";
import { useIdParam } from "@/hooks/use-id-param";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";

export default function MaterialRoute() {
  const { id, valid } = useIdParam("materialId");
  const { data, error, isPending } = useQuery({ ...materialQueries.detail(id), enabled: valid });
  if (!valid || (isApiError(error) && (error.status === 404 || error.status === 400)))
    return <InPageNotFound what="Material" backTo={paths.materials} backLabel="Back to materials" />;
  if (isPending || !data) return <Spinner label="Loading the material…" />;
  return <MaterialPage material={data} />;
}

function Fact({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div>
      <dt className="text-xs font-semibold tracking-wide text-primer-700 uppercase">{label}</dt>
      <dd className="mt-0.5 text-base text-ink-950 tabular-nums">{children}</dd>
    </div>
  );
}

const orDash = (v: number | null, unit = "", digits = 2) => (v == null ? "—" : `${formatNumber(v, digits)}${unit}`);

function MaterialPage({ material: m }: { material: MaterialDetailDto }) {
  const user = useCurrentUser();
  const office = roleCan(user.role, "office");
  const [dialog, setDialog] = useState<"edit" | "delete" | null>(null);
  return (
    <>
      <PageHeader
        documentTitle={`${m.code} ${m.name}`}
        eyebrow={<span className="font-mono">{m.code}</span>}
        title={m.name}
        description={
          <span className="inline-flex flex-wrap items-center gap-2">
            {MATERIAL_CATEGORY_LABELS[m.category]}
            {!m.active ? <span className="rounded bg-primer-200 px-1.5 py-0.5 text-xs font-medium">Retired</span> : null}
            <HazardIcons material={m} />
          </span>
        }
        actions={
          office ? (
            <>
              <Button variant="secondary" onClick={() => setDialog("edit")} icon={<Pencil aria-hidden className="size-4" />}>
                Edit material
              </Button>
              <Button variant="danger" onClick={() => setDialog("delete")} icon={<Trash2 aria-hidden className="size-4" />}>
                Delete
              </Button>
            </>
          ) : null
        }
      />
      <div className="grid gap-6 xl:grid-cols-[minmax(0,1fr)_24rem]">
        <div className="flex min-w-0 flex-col gap-6">
          <Panel>
            <dl className="grid grid-cols-2 gap-x-6 gap-y-4 sm:grid-cols-3">
              <Fact label="Bought by the">{PURCHASE_UNIT_NAMES[m.purchaseUnit]}</Fact>
              {office ? <Fact label="Cost per unit">{m.costCents == null ? "—" : formatCents(m.costCents)}</Fact> : null}
              <Fact label="On hand">
                <span className={m.lowStock ? "font-semibold text-red-800" : undefined}>
                  {formatAmount(m.stockOnHand, m.purchaseUnit, 3)}
                  {m.lowStock ? " (low)" : ""}
                </span>
              </Fact>
              <Fact label="Low-stock level">{m.lowStockThreshold == null ? "—" : formatAmount(m.lowStockThreshold, m.purchaseUnit)}</Fact>
              <Fact label="Volume solids">{orDash(m.volumeSolidsPct, " %", 1)}</Fact>
              <Fact label="VOC, less water and exempt">{orDash(m.vocGPerL, " g/L", 0)}</Fact>
              <Fact label="Water and exempt">{orDash(m.waterExemptPct, " %", 1)}</Fact>
              <Fact label="Density">{orDash(m.densityGPerMl, " g/mL", 3)}</Fact>
              <Fact label="Pot life">{m.potLifeMinutes == null ? "—" : formatMinutes(m.potLifeMinutes)}</Fact>
              <Fact label="Induction">{m.inductionMinutes == null ? "—" : formatMinutes(m.inductionMinutes)}</Fact>
              <Fact label="Recoat window">{m.recoatMinMinutes == null && m.recoatMaxMinutes == null ? "—" : `${formatMinutes(m.recoatMinMinutes ?? 0)} to ${m.recoatMaxMinutes != null ? formatMinutes(m.recoatMaxMinutes) : "any time"} after the last coat`}</Fact>
            </dl>
            {m.notes ? <p className="mt-5 border-t border-primer-200 pt-4 whitespace-pre-line">{m.notes}</p> : null}
          </Panel>
          <SafetyCautions cautions={m.cautions} />
          <LotsPanel materialId={m.id} unit={m.purchaseUnit} lots={m.lots} canEdit={office} />
        </div>
        <DataSheetsPanel materialId={m.id} files={m.files} canEdit={office} />
      </div>
      {dialog === "edit" ? <EditMaterialDialog material={m} onClose={() => setDialog(null)} /> : null}
      {dialog === "delete" ? <DeleteMaterialDialog material={m} onClose={() => setDialog(null)} /> : null}
    </>
  );
}

function EditMaterialDialog({ material: m, onClose }: { material: MaterialDetailDto; onClose: () => void }) {
  const update = useUpdateMaterial(m.id);
  const s = (v: number | null) => (v == null ? "" : String(v));
  return (
    <Dialog title={`Edit ${m.code}`} onClose={onClose} size="lg">
      <MaterialForm
        submitLabel="Save material"
        defaultValues={{
          code: m.code,
          name: m.name,
          category: m.category,
          purchaseUnit: m.purchaseUnit,
          cost: centsToInput(m.costCents),
          volumeSolidsPct: s(m.volumeSolidsPct),
          vocGPerL: s(m.vocGPerL),
          waterExemptPct: s(m.waterExemptPct),
          densityGPerMl: s(m.densityGPerMl),
          potLifeMinutes: s(m.potLifeMinutes),
          inductionMinutes: s(m.inductionMinutes),
          recoatMinMinutes: s(m.recoatMinMinutes),
          recoatMaxMinutes: s(m.recoatMaxMinutes),
          lowStockThreshold: s(m.lowStockThreshold),
          containsIsocyanates: m.containsIsocyanates,
          flammable: m.flammable,
          active: m.active,
          notes: m.notes ?? "",
        }}
        onCancel={onClose}
        onSubmit={async (values) => {
          await update.mutateAsync({ ...values, version: m.version });
          toast.success("Material saved");
          onClose();
        }}
      />
    </Dialog>
  );
}

function DeleteMaterialDialog({ material: m, onClose }: { material: MaterialDetailDto; onClose: () => void }) {
  const remove = useDeleteMaterial();
  const navigate = useNavigate();
  return (
    <ConfirmDialog
      title={`Delete ${m.code}?`}
      confirmLabel="Delete material"
      keepLabel="Keep it"
      pending={remove.isPending}
      failure="The material could not be deleted."
      onConfirm={async () => {
        await remove.mutateAsync(m.id);
        return `Deleted ${m.code}`;
      }}
      onDone={() => navigate(paths.materials, { replace: true })}
      onClose={onClose}
    >
      A material used by a plan or a mix sheet cannot be deleted; retire it instead so the records keep it.
    </ConfirmDialog>
  );
}
