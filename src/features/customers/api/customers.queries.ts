import { keepPreviousData, queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { Page } from "@shared/api/pagination";
import type { PickerPage } from "@/components/ui/form/search-picker";
import type { CreateCustomerInput, CustomerDto, UpdateCustomerInput } from "@shared/schemas/customer.schema";

export type CustomerSortField = "name" | "email" | "createdAt" | "jobCount";
export type CustomerListParams = {
  page?: number;
  pageSize?: number;
  q?: string;
  sort?: CustomerSortField | `-${CustomerSortField}`;
};

export const customerKeys = {
  all: ["customers"] as const,
  lists: () => [...customerKeys.all, "list"] as const,
  list: (params: CustomerListParams) => [...customerKeys.lists(), params] as const,
  options: () => [...customerKeys.all, "options"] as const,
  search: (q: string) => [...customerKeys.options(), "search", q] as const,
  details: () => [...customerKeys.all, "detail"] as const,
  detail: (id: number) => [...customerKeys.details(), id] as const,
};

/** The API's largest page: enough for the pick lists of a small shop. */
const OPTIONS_PAGE_SIZE = 100;
/** Matches shown at once in a searchable pick list; typing narrows the rest. */
const PICKER_PAGE_SIZE = 20;

export const customerQueries = {
  list: (params: CustomerListParams) =>
    queryOptions({
      queryKey: customerKeys.list(params),
      queryFn: ({ signal }) => api.get<Page<CustomerDto>>("/customers", { query: params, signal }),
      placeholderData: keepPreviousData,
    }),
  /** Customers for a pick list, by name. */
  options: () =>
    queryOptions({
      queryKey: customerKeys.options(),
      queryFn: ({ signal }) =>
        api.get<Page<CustomerDto>>("/customers", { query: { pageSize: OPTIONS_PAGE_SIZE, sort: "name" }, signal }),
      select: (page) => ({ options: page.items.map((c) => ({ id: c.id, name: c.name })), total: page.total }),
      staleTime: 60_000,
    }),
  /** One page of customers whose name, e-mail or phone holds `q` (the searchable pick list), by name. */
  search: (q: string) =>
    queryOptions({
      queryKey: customerKeys.search(q),
      queryFn: async ({ signal }): Promise<PickerPage> => {
        const page = await api.get<Page<CustomerDto>>("/customers", { query: { pageSize: PICKER_PAGE_SIZE, sort: "name", ...(q ? { q } : {}) }, signal });
        return { options: page.items.map((c) => ({ id: String(c.id), name: c.name, ...(c.email ? { detail: c.email } : {}) })), total: page.total };
      },
      placeholderData: keepPreviousData,
      staleTime: 30_000,
    }),
  detail: (id: number) =>
    queryOptions({
      queryKey: customerKeys.detail(id),
      queryFn: ({ signal }) => api.get<CustomerDto>(`/customers/${id}`, { signal }),
    }),
};

export function useCreateCustomer() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateCustomerInput) => api.post<CustomerDto>("/customers", input),
    onSuccess: (customer) => {
      queryClient.setQueryData(customerKeys.detail(customer.id), customer);
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: customerKeys.lists() }),
        queryClient.invalidateQueries({ queryKey: customerKeys.options() }),
      ]);
    },
  });
}

export function useUpdateCustomer(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateCustomerInput) => api.patch<CustomerDto>(`/customers/${id}`, input),
    onSuccess: (customer) => {
      queryClient.setQueryData(customerKeys.detail(id), customer);
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: customerKeys.lists() }),
        queryClient.invalidateQueries({ queryKey: customerKeys.options() }),
        // Job rows show the customer's name.
        queryClient.invalidateQueries({ queryKey: ["jobs"] }),
      ]);
    },
  });
}

export function useDeleteCustomer() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api.delete(`/customers/${id}`),
    onSuccess: (_data, id) => {
      queryClient.removeQueries({ queryKey: customerKeys.detail(id) });
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: customerKeys.lists() }),
        queryClient.invalidateQueries({ queryKey: customerKeys.options() }),
      ]);
    },
  });
}
