import { useQuery } from "@tanstack/react-query";
import { Eye, EyeOff, Trash2 } from "lucide-react";
import type { UploadDto } from "@shared/schemas/upload.schema";
import { PANEL_LIGHT_LABELS, PANEL_LIGHTS, type PanelLight } from "@shared/domain/spray-setup";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { toast } from "@/components/ui/toast/toast-store";
import { cn } from "@/utils/cn";
import { uploadQueries, useDeleteUpload, useUpdateUpload, type UploadOwner } from "../api/uploads.queries";
import { PhotoUploadButton } from "./photo-upload-button";

/**
 * Photos of one record (a job, an item, a prep record, a coat, a test panel): add one with a progress bar,
 * see thumbnails, share a job photo with the customer, remove your own. The server checks every file by content.
 */
export function PhotoPanel({
  owner,
  title = "Photos",
  canShare,
  canDeleteAll,
  currentUserId,
  compact = false,
  listJobId,
}: {
  owner: UploadOwner;
  title?: string;
  /** Staff on a job's photos: the customer sees a photo only when it is shared. */
  canShare: boolean;
  /** The office removes any photo; others only the ones they added. */
  canDeleteAll: boolean;
  currentUserId: string;
  compact?: boolean;
  /** List every photo of this job (prep, coats, panels too), while new photos still go on `owner`. */
  listJobId?: number;
}) {
  const byJob = useQuery({ ...uploadQueries.job(listJobId ?? 0), enabled: listJobId !== undefined });
  const byOwner = useQuery({ ...uploadQueries.owner(owner), enabled: listJobId === undefined });
  const photos = listJobId !== undefined ? byJob : byOwner;
  return (
    <section aria-label={title} className="flex flex-col gap-3">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h3 className={cn("font-semibold text-ink-950", compact ? "text-base" : "text-lg")}>{title}</h3>
        <PhotoUploadButton owner={owner} />
      </div>
      {photos.isPending ? (
        <p className="text-sm text-primer-700">Loading photos…</p>
      ) : photos.error ? (
        <Alert tone="error">{photos.error.message}</Alert>
      ) : photos.data.length === 0 ? (
        <p className="text-sm text-primer-700">No photos yet.</p>
      ) : (
        <ul className="grid grid-cols-[repeat(auto-fill,minmax(8.5rem,1fr))] gap-3">
          {photos.data.map((p) => (
            <PhotoTile key={p.id} photo={p} canShare={canShare} canDelete={canDeleteAll || p.uploadedById === currentUserId} />
          ))}
        </ul>
      )}
    </section>
  );
}

function PhotoTile({ photo, canShare, canDelete }: { photo: UploadDto; canShare: boolean; canDelete: boolean }) {
  const update = useUpdateUpload();
  const remove = useDeleteUpload();
  const label = photo.caption ?? photo.originalName;
  return (
    <li className="flex flex-col gap-1.5 rounded-lg border border-primer-200 bg-white p-2">
      <a href={photo.url} target="_blank" rel="noreferrer" className="block overflow-hidden rounded-md">
        <img src={photo.thumbUrl ?? photo.url} alt={label} className="aspect-square w-full object-cover" loading="lazy" />
      </a>
      <p className="truncate text-xs text-primer-800" title={label}>
        {label}
      </p>
      {photo.ownerType === "panel" ? (
        // A panel's colour depends on the light it is seen under: each photo says which.
        <label className="flex flex-col gap-0.5 text-xs font-semibold text-ink-950">
          Light
          <select
            className="min-h-11 rounded-md border border-primer-300 bg-white px-1 text-sm font-normal"
            value={photo.light ?? ""}
            disabled={update.isPending}
            onChange={(e) => update.mutate({ id: photo.id, light: (e.target.value || null) as PanelLight | null, version: photo.version }, { onError: (err) => toast.error(err.message) })}
          >
            <option value="">Not said</option>
            {PANEL_LIGHTS.map((l) => (
              <option key={l} value={l}>
                {PANEL_LIGHT_LABELS[l]}
              </option>
            ))}
          </select>
        </label>
      ) : null}
      <div className="flex gap-1.5">
        {canShare && photo.jobId !== null ? (
          <button
            type="button"
            aria-pressed={photo.shareable}
            disabled={update.isPending}
            onClick={() => update.mutate({ id: photo.id, shareable: !photo.shareable, version: photo.version }, { onError: (e) => toast.error(e.message) })}
            className={cn(
              "inline-flex min-h-11 flex-1 items-center justify-center gap-1 rounded-md border text-xs font-semibold",
              photo.shareable ? "border-emerald-700 bg-emerald-50 text-emerald-950" : "border-primer-300 bg-white text-ink-950",
            )}
          >
            {photo.shareable ? <Eye aria-hidden className="size-4" /> : <EyeOff aria-hidden className="size-4" />}
            {photo.shareable ? "Shared" : "Share"}
            <span className="sr-only"> {label} with the customer</span>
          </button>
        ) : null}
        {canDelete ? (
          <Button
            variant="ghost"
            size="sm"
            className="min-h-11"
            disabled={remove.isPending}
            onClick={() => {
              if (window.confirm(`Remove ${label}?`)) remove.mutate(photo.id, { onError: (e) => toast.error(e.message) });
            }}
          >
            <Trash2 aria-hidden className="size-4" />
            <span className="sr-only">Remove {label}</span>
          </Button>
        ) : null}
      </div>
    </li>
  );
}
