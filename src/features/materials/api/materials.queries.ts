import { queryOptions, useMutation, useQueryClient, type QueryClient } from "@tanstack/react-query";
import { api, apiUrl } from "@/lib/api-client";
import { uploadWithProgress } from "@/lib/upload-with-progress";
import type { MaterialCategory } from "@shared/domain/materials";
import type {
  CreateLotInput,
  CreateMaterialInput,
  LotDto,
  MaterialDetailDto,
  MaterialDto,
  MaterialFileDto,
  MaterialFileKind,
  UpdateLotInput,
  UpdateMaterialInput,
} from "@shared/schemas/material.schema";

export type MaterialListParams = { category?: MaterialCategory; q?: string; includeInactive?: boolean };

export const materialKeys = {
  all: ["materials"] as const,
  lists: () => [...materialKeys.all, "list"] as const,
  list: (params: MaterialListParams) => [...materialKeys.lists(), params] as const,
  lowStock: () => [...materialKeys.all, "low-stock"] as const,
  detail: (id: number) => [...materialKeys.all, "detail", id] as const,
};

export const materialQueries = {
  list: (params: MaterialListParams = {}) =>
    queryOptions({
      queryKey: materialKeys.list(params),
      queryFn: ({ signal }) => api.get<MaterialDto[]>("/materials", { query: params, signal }),
    }),
  lowStock: () =>
    queryOptions({
      queryKey: materialKeys.lowStock(),
      queryFn: ({ signal }) => api.get<MaterialDto[]>("/materials/low-stock", { signal }),
    }),
  detail: (id: number) =>
    queryOptions({
      queryKey: materialKeys.detail(id),
      queryFn: ({ signal }) => api.get<MaterialDetailDto>(`/materials/${id}`, { signal }),
    }),
};

/** The address of a stored data sheet (opens in the browser's viewer). */
export const materialFileUrl = (materialId: number, fileId: number) => apiUrl(`/materials/${materialId}/files/${fileId}`);

/** Any write to the catalogue or its stock: the lists and low-stock list refetch; the detail is refreshed. */
function afterWrite(queryClient: QueryClient, id?: number) {
  return Promise.all([
    queryClient.invalidateQueries({ queryKey: materialKeys.lists() }),
    queryClient.invalidateQueries({ queryKey: materialKeys.lowStock() }),
    ...(id ? [queryClient.invalidateQueries({ queryKey: materialKeys.detail(id) })] : []),
  ]);
}

export function useCreateMaterial() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateMaterialInput) => api.post<MaterialDetailDto>("/materials", input),
    onSuccess: (m) => {
      queryClient.setQueryData(materialKeys.detail(m.id), m);
      return afterWrite(queryClient);
    },
  });
}

export function useUpdateMaterial(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateMaterialInput) => api.patch<MaterialDetailDto>(`/materials/${id}`, input),
    onSuccess: (m) => {
      queryClient.setQueryData(materialKeys.detail(id), m);
      return afterWrite(queryClient);
    },
  });
}

export function useDeleteMaterial() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api.delete(`/materials/${id}`),
    onSuccess: (_d, id) => {
      queryClient.removeQueries({ queryKey: materialKeys.detail(id) });
      return afterWrite(queryClient);
    },
  });
}

export function useCreateLot(materialId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateLotInput) => api.post<LotDto>(`/materials/${materialId}/lots`, input),
    onSuccess: () => afterWrite(queryClient, materialId),
  });
}

export function useUpdateLot(materialId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ lotId, ...input }: UpdateLotInput & { lotId: number }) => api.patch<LotDto>(`/materials/${materialId}/lots/${lotId}`, input),
    onSuccess: () => afterWrite(queryClient, materialId),
  });
}

export function useDeleteLot(materialId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (lotId: number) => api.delete(`/materials/${materialId}/lots/${lotId}`),
    onSuccess: () => afterWrite(queryClient, materialId),
  });
}

export type UploadFileInput = { file: File; kind: MaterialFileKind; onProgress?: (fraction: number) => void };

export function useUploadMaterialFile(materialId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ file, kind, onProgress }: UploadFileInput) => {
      const form = new FormData();
      form.set("kind", kind);
      form.set("file", file);
      return uploadWithProgress<MaterialFileDto>(`/materials/${materialId}/files`, form, onProgress);
    },
    onSuccess: () => queryClient.invalidateQueries({ queryKey: materialKeys.detail(materialId) }),
  });
}

export function useDeleteMaterialFile(materialId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (fileId: number) => api.delete(`/materials/${materialId}/files/${fileId}`),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: materialKeys.detail(materialId) }),
  });
}
