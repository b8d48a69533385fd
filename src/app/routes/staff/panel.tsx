import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { Link, useNavigate } from "react-router";
import { Layers3, Pencil, Repeat2, Trash2 } from "lucide-react";
import { roleCan } from "@shared/domain/roles";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { Button, ButtonLink } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { PageHeader } from "@/components/ui/page-header";
import { Panel } from "@/components/ui/panel";
import { Spinner } from "@/components/ui/spinner";
import { toast } from "@/components/ui/toast/toast-store";
import { paths } from "@/config/paths";
import { useCurrentUser } from "@/features/auth/hooks/use-current-user";
import { panelQueries, useDeletePanel, useSetApprovedPanel, useUpdatePanel } from "@/features/panels/api/panels.queries";
import { PanelForm } from "@/features/panels/components/panel-form";
import { formatLab, PanelSwatch } from "@/features/panels/components/panel-swatch";
import { VerdictBadge } from "@/features/panels/components/verdict-badge";
import { PhotoPanel } from "@/features/uploads/components/photo-panel";
import { formatDate } from "@/utils/format-date";
import type { PanelDto } from "@shared/schemas/panel.schema";
import { PANEL_LIGHT_LABELS } from "@shared/domain/spray-setup";
import { RepeatFinishDialog } from "@/features/finish-record/components/repeat-finish-dialog";
import { InPageNotFound } from "../in-page-not-found";
import { useIdParam } from "@/hooks/use-id-param";

export default function PanelRoute() {
  const { id, valid } = useIdParam("panelId");
  const panel = useQuery({ ...panelQueries.detail(id), enabled: valid });
  if (!valid || (isApiError(panel.error) && (panel.error.status === 404 || panel.error.status === 400)))
    return <InPageNotFound what="Test panel" backTo={paths.panels} backLabel="Back to the panels" />;
  if (panel.error) return <Alert tone="error">{panel.error.message}</Alert>;
  if (!panel.data) return <Spinner label="Loading the panel…" />;
  return <PanelPage panel={panel.data} />;
}

function PanelPage({ panel }: { panel: PanelDto }) {
  const user = useCurrentUser();
  const office = roleCan(user.role, "office");
  const navigate = useNavigate();
  const [editing, setEditing] = useState(false);
  const [repeating, setRepeating] = useState(false);
  const remove = useDeletePanel();
  const approve = useSetApprovedPanel(panel.jobId ?? 0);
  const facets = useQuery(panelQueries.list({ pageSize: 1 }));
  const rows: [string, string][] = [
    ["Ground coat", panel.groundName],
    ["Candy", panel.candyName],
    [
      "Let-down (clear : toner)",
      `${panel.letDownClear}:${panel.letDownToner} · toner ${(panel.tonerFraction * 100).toFixed(2)} % of clear + toner` +
        (panel.mixSheet?.tonerReadyPct != null ? `, ${panel.mixSheet.tonerReadyPct.toFixed(2)} % of the ready-to-spray batch` : ""),
    ],
    ["Coats", String(panel.coats)],
    ["Meter reading (daylight, D65)", formatLab(panel.lab)],
    ...panel.readings.map((r): [string, string] => [`Reading, ${PANEL_LIGHT_LABELS[r.light].toLowerCase()} (${r.illuminant})`, formatLab(r.lab)]),
    ["Spray set-up", panel.setup.summary || "—"],
    [
      "Booth",
      [panel.conditions.boothTemp != null ? `${panel.conditions.boothTemp} °${panel.conditions.tempUnit ?? ""}` : null, panel.conditions.humidityPct != null ? `${panel.conditions.humidityPct} % RH` : null]
        .filter(Boolean)
        .join(", ") || "—",
    ],
    ...(panel.planLayer ? [["Plan layer", `${panel.planLayer.name} (${panel.planLayer.planName}, version ${panel.planLayer.version})`] as [string, string]] : []),
    ...(panel.mixSheet
      ? [["Batch", `#${panel.mixSheet.id}${panel.mixSheet.lots.length ? ` · ${panel.mixSheet.lots.map((l) => `${l.materialCode} lot ${l.lotNumber ?? "—"}`).join(", ")}` : ""}`] as [string, string]]
      : []),
    ["Sprayed on", panel.sprayedOn ? formatDate(panel.sprayedOn) : "—"],
    ["Made by", panel.createdByName ?? "—"],
  ];
  return (
    <>
      <PageHeader
        eyebrow={`Test panel #${panel.id}`}
        title={panel.label}
        actions={
          <>
            <ButtonLink to={paths.panelsLadder(panel.groundName, panel.candyName)} variant="secondary" icon={<Layers3 aria-hidden className="size-5" />}>
              Depth ladder
            </ButtonLink>
            {office && panel.planLayer ? (
              <Button variant="secondary" icon={<Repeat2 aria-hidden className="size-4" />} onClick={() => setRepeating(true)}>
                Repeat as a new job…
              </Button>
            ) : null}
            {office || panel.createdById === user.id ? (
              <Button variant="secondary" icon={<Pencil aria-hidden className="size-4" />} onClick={() => setEditing(true)}>
                Edit
              </Button>
            ) : null}
            {office ? (
              <Button
                variant="danger"
                icon={<Trash2 aria-hidden className="size-4" />}
                pending={remove.isPending}
                onClick={() => {
                  if (!window.confirm(`Delete ${panel.label}? Its photos go too.`)) return;
                  remove.mutate(panel.id, {
                    onSuccess: () => {
                      toast.success("Panel deleted");
                      navigate(paths.panels, { replace: true });
                    },
                    onError: (e) => toast.error(e.message),
                  });
                }}
              >
                Delete
              </Button>
            ) : null}
          </>
        }
      />
      <div className="grid gap-6 lg:grid-cols-[18rem_minmax(0,1fr)]">
        <PanelSwatch panel={panel} className="max-w-72" />
        <div className="flex flex-col gap-5">
          <Panel>
            <dl className="grid gap-x-6 gap-y-2 sm:grid-cols-[auto_1fr]">
              {rows.map(([k, v]) => (
                <div key={k} className="contents">
                  <dt className="text-sm font-semibold text-primer-800">{k}</dt>
                  <dd className="text-base text-ink-950 tabular-nums">{v}</dd>
                </div>
              ))}
              {panel.jobTitle ? (
                <div className="contents">
                  <dt className="text-sm font-semibold text-primer-800">Made for</dt>
                  <dd className="text-base">
                    <Link className="text-candy-700 underline underline-offset-2" to={paths.job(panel.jobId!)}>
                      {panel.jobTitle}
                    </Link>
                  </dd>
                </div>
              ) : null}
            </dl>
            {panel.notes ? <p className="mt-4 whitespace-pre-line text-ink-950">{panel.notes}</p> : null}
          </Panel>
          {panel.isApprovedForJob ? <Alert tone="success">This panel is the approved colour of its job.</Alert> : null}
          {panel.vsApproved ? (
            <Panel title="Against the job's approved colour" titleId="vs-heading">
              <VerdictBadge verdict={panel.vsApproved.verdict} deltaE={panel.vsApproved.deltaE} />
              <p className="mt-2 text-base text-ink-950">{panel.vsApproved.text}.</p>
            </Panel>
          ) : null}
          {office && panel.jobId && !panel.isApprovedForJob ? (
            <div>
              <Button
                size="lg"
                pending={approve.isPending}
                onClick={() => approve.mutate(panel.id, { onSuccess: () => toast.success("Approved as the job's colour"), onError: (e) => toast.error(e.message) })}
              >
                Approve as the job&apos;s colour
              </Button>
            </div>
          ) : null}
          <Panel>
            <PhotoPanel owner={{ ownerType: "panel", ownerId: panel.id }} canShare={!!panel.jobId} canDeleteAll={office} currentUserId={user.id} />
          </Panel>
        </div>
      </div>
      {repeating ? (
        <RepeatFinishDialog
          from={{ panelId: panel.id }}
          defaultCustomerId={null}
          defaultTitle={`${panel.candyName} over ${panel.groundName}`}
          onClose={() => setRepeating(false)}
        />
      ) : null}
      {editing ? (
        <EditPanelDialog panel={panel} grounds={facets.data?.facets.grounds ?? []} candies={facets.data?.facets.candies ?? []} onClose={() => setEditing(false)} />
      ) : null}
    </>
  );
}

const text = (n: number | null) => (n == null ? "" : String(n));

function EditPanelDialog({ panel, grounds, candies, onClose }: { panel: PanelDto; grounds: string[]; candies: string[]; onClose: () => void }) {
  const update = useUpdatePanel(panel.id);
  return (
    <Dialog title={`Edit panel #${panel.id}`} onClose={onClose} size="lg">
      <PanelForm
        grounds={grounds}
        candies={candies}
        defaultValues={{
          groundName: panel.groundName,
          candyName: panel.candyName,
          letDownClear: String(panel.letDownClear),
          letDownToner: String(panel.letDownToner),
          coats: String(panel.coats),
          labL: panel.lab ? String(panel.lab.L) : "",
          labA: panel.lab ? String(panel.lab.a) : "",
          labB: panel.lab ? String(panel.lab.b) : "",
          sprayedOn: panel.sprayedOn ?? "",
          notes: panel.notes ?? "",
          groundMaterialId: panel.groundMaterialId != null ? String(panel.groundMaterialId) : "",
          jobId: panel.jobId ?? undefined,
          planLayerId: panel.planLayer ? String(panel.planLayer.id) : "",
          mixSheetId: panel.mixSheet ? String(panel.mixSheet.id) : "",
          gunId: panel.setup.gunId != null ? String(panel.setup.gunId) : "",
          tipMm: text(panel.setup.tipMm),
          inletPressure: text(panel.setup.inletPressure),
          pressureUnit: panel.setup.pressureUnit ?? "psi",
          distance: text(panel.setup.distance),
          fanWidth: text(panel.setup.fanWidth),
          distanceUnit: panel.setup.distanceUnit ?? "in",
          overlapPct: text(panel.setup.overlapPct),
          boothTemp: text(panel.conditions.boothTemp),
          tempUnit: panel.conditions.tempUnit ?? "F",
          humidityPct: text(panel.conditions.humidityPct),
          readings: panel.readings.map((r) => ({ light: r.light, illuminant: r.illuminant, labL: String(r.lab.L), labA: String(r.lab.a), labB: String(r.lab.b) })),
        }}
        submitLabel="Save panel"
        onCancel={onClose}
        onSubmit={async (values) => {
          const { jobId: _jobId, ...rest } = values;
          await update.mutateAsync({ ...rest, labL: rest.labL ?? null, labA: rest.labA ?? null, labB: rest.labB ?? null, version: panel.version });
          toast.success("Panel saved");
          onClose();
        }}
      />
    </Dialog>
  );
}
