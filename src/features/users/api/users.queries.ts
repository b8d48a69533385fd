import { keepPreviousData, queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { Page } from "@shared/api/pagination";
import type { PickerPage } from "@/components/ui/form/search-picker";
import type { Role } from "@shared/domain/roles";
import type { CreateUserInput, PainterDto, UpdateUserInput, UserDto } from "@shared/schemas/user.schema";

export type UserSortField = "name" | "email" | "role" | "createdAt";
export type UserListParams = {
  page?: number;
  pageSize?: number;
  q?: string;
  role?: Role;
  sort?: UserSortField | `-${UserSortField}`;
};

export const userKeys = {
  all: ["users"] as const,
  lists: () => [...userKeys.all, "list"] as const,
  list: (params: UserListParams) => [...userKeys.lists(), params] as const,
  painters: () => [...userKeys.all, "painters"] as const,
  searches: () => [...userKeys.all, "search"] as const,
  search: (q: string) => [...userKeys.searches(), q] as const,
  detail: (id: string) => [...userKeys.all, "detail", id] as const,
};

export const userQueries = {
  list: (params: UserListParams) =>
    queryOptions({
      queryKey: userKeys.list(params),
      queryFn: ({ signal }) => api.get<Page<UserDto>>("/users", { query: params, signal }),
      placeholderData: keepPreviousData,
    }),
  /** One page of people whose name or e-mail holds `q` (the searchable pick list), by name. */
  search: (q: string) =>
    queryOptions({
      queryKey: userKeys.search(q),
      queryFn: async ({ signal }): Promise<PickerPage> => {
        const page = await api.get<Page<UserDto>>("/users", { query: { pageSize: 20, sort: "name", ...(q ? { q } : {}) }, signal });
        return { options: page.items.map((u) => ({ id: u.id, name: u.name, detail: u.email })), total: page.total };
      },
      placeholderData: keepPreviousData,
      staleTime: 30_000,
    }),
  detail: (id: string) =>
    queryOptions({
      queryKey: userKeys.detail(id),
      queryFn: ({ signal }) => api.get<UserDto>(`/users/${encodeURIComponent(id)}`, { signal }),
      staleTime: 60_000,
    }),
  /** Active painters, for assigning jobs (office roles). */
  painters: () =>
    queryOptions({
      queryKey: userKeys.painters(),
      queryFn: ({ signal }) => api.get<PainterDto[]>("/painters", { signal }),
      staleTime: 5 * 60_000,
    }),
};

function useAfterUserWrite() {
  const queryClient = useQueryClient();
  return () =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: userKeys.lists() }),
      queryClient.invalidateQueries({ queryKey: userKeys.painters() }),
      queryClient.invalidateQueries({ queryKey: userKeys.searches() }),
    ]);
}

export function useCreateUser() {
  const refresh = useAfterUserWrite();
  return useMutation({
    mutationFn: (input: CreateUserInput) => api.post<UserDto>("/users", input),
    onSuccess: refresh,
  });
}

export function useUpdateUser() {
  const refresh = useAfterUserWrite();
  return useMutation({
    mutationFn: ({ id, ...input }: UpdateUserInput & { id: string }) => api.patch<UserDto>(`/users/${id}`, input),
    onSuccess: refresh,
  });
}
