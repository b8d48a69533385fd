import { useId, useRef, useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { Camera, Eye, EyeOff, Trash2 } from "lucide-react";
import { MAX_PHOTO_MB, type UploadDto } from "@shared/schemas/upload.schema";
import { PANEL_LIGHT_LABELS, PANEL_LIGHTS, type PanelLight } from "@shared/domain/spray-setup";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { toast } from "@/components/ui/toast/toast-store";
import { cn } from "@/utils/cn";
import { uploadQueries, useDeleteUpload, useUpdateUpload, useUploadPhoto, type UploadOwner } from "../api/uploads.queries";

const ACCEPT = "image/jpeg,image/png,image/webp";

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

export function PhotoUploadButton({ owner, label = "Add photo" }: { owner: UploadOwner; label?: string }) {
  const inputId = useId();
  const statusId = useId();
  const input = useRef<HTMLInputElement>(null);
  const upload = useUploadPhoto(owner);
  const [problem, setProblem] = useState<string | null>(null);

  const send = async (file: File | undefined) => {
    if (!file) return;
    setProblem(null);
    try {
      await upload.mutateAsync({ file });
      toast.success(`${file.name} added`);
    } catch (error) {
      setProblem(isApiError(error) ? error.message : "The photo could not be sent. Try again.");
    } finally {
      if (input.current) input.current.value = "";
    }
  };

  return (
    <div className="flex flex-col items-end gap-2">
      <input
        ref={input}
        id={inputId}
        type="file"
        accept={ACCEPT}
        className="sr-only"
        aria-describedby={statusId}
        onChange={(e) => void send(e.target.files?.[0])}
        disabled={upload.isPending}
      />
      <label
        htmlFor={inputId}
        className={cn(
          "inline-flex min-h-12 cursor-pointer items-center gap-2 rounded-lg border border-primer-300 bg-white px-4 text-base font-semibold text-ink-950 shadow-card hover:bg-primer-100",
          "[input:focus-visible+&]:outline-3 [input:focus-visible+&]:outline-offset-2 [input:focus-visible+&]:outline-candy-600",
          upload.isPending && "pointer-events-none opacity-60",
        )}
      >
        <Camera aria-hidden className="size-5" />
        {label}
      </label>
      <div id={statusId} className="w-56 text-right text-sm" aria-live="polite">
        {upload.progress !== null ? (
          <>
            <progress className="h-3 w-full accent-candy-600" max={1} value={upload.progress} aria-label="Upload progress" />
            <span className="text-primer-800">Sending… {Math.round(upload.progress * 100)}%</span>
          </>
        ) : (
          <span className="text-primer-700">JPEG, PNG or WebP (not HEIC), up to {MAX_PHOTO_MB} MB</span>
        )}
      </div>
      {problem ? (
        <Alert tone="error" className="w-full max-w-md text-left">
          {problem}
        </Alert>
      ) : null}
    </div>
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
