import { useId, useRef, useState } from "react";
import { Camera } from "lucide-react";
import { MAX_PHOTO_MB } from "@shared/domain/photo-limits";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { toast } from "@/components/ui/toast/toast-store";
import { cn } from "@/utils/cn";
import { useQueuedPhoto, useUploadPhoto, type QueuedPhoto, type UploadOwner } from "../api/uploads.queries";

const ACCEPT = "image/jpeg,image/png,image/webp";

/**
 * Add one photo to a record, with a progress bar (its own file, so the booth card loads it without the photo gallery).
 * With `queue` (the booth card), the photo goes through the tablet's queue: offline it waits there and is sent once.
 */
export function PhotoUploadButton({ owner, label = "Add photo", queue }: { owner: UploadOwner; label?: string; queue?: QueuedPhoto }) {
  const inputId = useId();
  const statusId = useId();
  const input = useRef<HTMLInputElement>(null);
  const direct = useUploadPhoto(owner);
  const queued = useQueuedPhoto(owner, queue);
  const pending = direct.isPending || queued.isPending;
  const [problem, setProblem] = useState<string | null>(null);

  const send = async (file: File | undefined) => {
    if (!file) return;
    // Refused here rather than after waiting on the tablet for a connection.
    if (file.size > MAX_PHOTO_MB * 1024 * 1024) {
      setProblem(`This photo is ${(file.size / 1024 / 1024).toFixed(1)} MB; photos are limited to ${MAX_PHOTO_MB} MB. Send a smaller photo.`);
      if (input.current) input.current.value = "";
      return;
    }
    setProblem(null);
    try {
      if (!queue) {
        await direct.mutateAsync({ file });
        toast.success(`${file.name} added`);
      } else if ((await queued.mutateAsync({ file })).queued) toast.info("Offline: the photo is kept on this tablet and sent when the connection is back");
      else toast.success(`${file.name} added`);
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
        disabled={pending}
      />
      <label
        htmlFor={inputId}
        className={cn(
          "inline-flex min-h-12 cursor-pointer items-center gap-2 rounded-lg border border-primer-300 bg-white px-4 text-base font-semibold text-ink-950 shadow-card hover:bg-primer-100",
          "[input:focus-visible+&]:outline-3 [input:focus-visible+&]:outline-offset-2 [input:focus-visible+&]:outline-candy-600",
          pending && "pointer-events-none opacity-60",
        )}
      >
        <Camera aria-hidden className="size-5" />
        {label}
      </label>
      <div id={statusId} className="w-56 text-right text-sm" aria-live="polite">
        {direct.progress !== null ? (
          <>
            <progress className="h-3 w-full accent-candy-600" max={1} value={direct.progress} aria-label="Upload progress" />
            <span className="text-primer-800">Sending… {Math.round(direct.progress * 100)}%</span>
          </>
        ) : queued.isPending ? (
          <span className="text-primer-800">Sending…</span>
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
