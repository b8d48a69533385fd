import { useState } from "react";
import { queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
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

export function useUpdateUpload() {
  const after = useAfterUpload();
  return useMutation({ mutationFn: ({ id, ...input }: UpdateUploadInput & { id: number }) => api.patch<UploadDto>(`/uploads/${id}`, input), onSuccess: after });
}

export function useDeleteUpload() {
  const after = useAfterUpload();
  return useMutation({ mutationFn: (id: number) => api.delete(`/uploads/${id}`), onSuccess: after });
}
