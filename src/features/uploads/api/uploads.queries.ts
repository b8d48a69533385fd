import { useState } from "react";
import { queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import { newEntryKey, offlineQueue } from "@/lib/offline/queue";
import { uploadWithProgress } from "@/lib/upload-with-progress";
import type { UpdateUploadInput, UploadDto, UploadOwnerType } from "@shared/schemas/upload.schema";

export type UploadOwner = { ownerType: Exclude<UploadOwnerType, "material">; ownerId: number };

export const uploadKeys = {
  all: ["uploads"] as const,
  job: (jobId: number) => [...uploadKeys.all, "job", jobId] as const,
  owner: (owner: UploadOwner) => [...uploadKeys.all, "owner", owner.ownerType, owner.ownerId] as const,
};

export const uploadQueries = {
  job: (jobId: number) =>
    queryOptions({ queryKey: uploadKeys.job(jobId), queryFn: ({ signal }) => api.get<UploadDto[]>("/uploads", { query: { jobId }, signal }) }),
  owner: (owner: UploadOwner) =>
    queryOptions({ queryKey: uploadKeys.owner(owner), queryFn: ({ signal }) => api.get<UploadDto[]>("/uploads", { query: owner, signal }) }),
};

/** Photos show up on prep records, panels and the booth card too: refresh all of those after a change. */
function useAfterUpload() {
  const queryClient = useQueryClient();
  return () =>
    Promise.all(
      [uploadKeys.all, ["prep"], ["panels"], ["booth"]].map((queryKey) => queryClient.invalidateQueries({ queryKey })),
    );
}

/** Sends one photo with a progress fraction (0–1) for the progress bar. */
export function useUploadPhoto(owner: UploadOwner) {
  const after = useAfterUpload();
  const [progress, setProgress] = useState<number | null>(null);
  const mutation = useMutation({
    mutationFn: ({ file, caption, shareable }: { file: File; caption?: string; shareable?: boolean }) => {
      const form = new FormData();
      form.set("ownerType", owner.ownerType);
      form.set("ownerId", String(owner.ownerId));
      if (caption) form.set("caption", caption);
      if (shareable) form.set("shareable", "true");
      form.set("file", file);
      setProgress(0);
      return uploadWithProgress<UploadDto>("/uploads", form, setProgress);
    },
    onSuccess: after,
    onSettled: () => setProgress(null),
  });
  return { ...mutation, progress };
}

/** A booth photo's queue details; `waitsFor` is the queue key of its coat when that coat is itself still waiting to send. */
export type QueuedPhoto = { jobId: number; label: string; clockOffsetMs: number; waitsFor?: string };

/**
 * A booth photo: kept in the tablet's queue (src/lib/offline/queue.ts) with its own Idempotency-Key and the time it
 * was taken (on the server's clock), and sent through the same upload route, at once or when the connection is back.
 * Resolves `queued` when it waits on the tablet.
 */
export function useQueuedPhoto(owner: UploadOwner, queue: QueuedPhoto | undefined) {
  const after = useAfterUpload();
  return useMutation({
    networkMode: "always",
    mutationFn: ({ file }: { file: File }) => {
      if (!queue) throw new Error("Not a queued photo");
      const madeAt = Date.now() + queue.clockOffsetMs;
      return offlineQueue.submit({
        key: newEntryKey(),
        kind: "photo",
        jobId: queue.jobId,
        path: "/uploads",
        // A photo of a coat still waiting gets its owner's id when the coat is stored (src/lib/offline/queue.ts).
        body: { ownerType: owner.ownerType, ...(queue.waitsFor ? {} : { ownerId: owner.ownerId }), at: new Date(madeAt).toISOString() },
        file: { blob: file, name: file.name },
        waitsFor: queue.waitsFor,
        madeAt,
        label: queue.label,
        refresh: [uploadKeys.all, ["booth", "card", queue.jobId]],
      });
    },
    onSuccess: (sent) => (sent.queued ? undefined : after()),
  });
}

export function useUpdateUpload() {
  const after = useAfterUpload();
  return useMutation({ mutationFn: ({ id, ...input }: UpdateUploadInput & { id: number }) => api.patch<UploadDto>(`/uploads/${id}`, input), onSuccess: after });
}

export function useDeleteUpload() {
  const after = useAfterUpload();
  return useMutation({ mutationFn: (id: number) => api.delete(`/uploads/${id}`), onSuccess: after });
}
