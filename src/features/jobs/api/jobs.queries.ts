import { keepPreviousData, queryOptions, useMutation, useQueryClient, type QueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { Page } from "@shared/api/pagination";
import type { Stage } from "@shared/domain/stages";
import type {
  BoardDto,
  ChangeStageInput,
  CreateJobInput,
  JobDetailDto,
  JobDto,
  JobSortField,
  UpdateJobInput,
} from "@shared/schemas/job.schema";

export type JobListParams = {
  page?: number;
  pageSize?: number;
  q?: string;
  sort?: JobSortField | `-${JobSortField}`;
  stage?: Stage[];
  customerId?: number;
  painterId?: string;
  due?: "overdue" | "week";
};

export const jobKeys = {
  all: ["jobs"] as const,
  lists: () => [...jobKeys.all, "list"] as const,
  list: (params: JobListParams) => [...jobKeys.lists(), params] as const,
  board: () => [...jobKeys.all, "board"] as const,
  details: () => [...jobKeys.all, "detail"] as const,
  detail: (id: number) => [...jobKeys.details(), id] as const,
};

export const jobQueries = {
  list: (params: JobListParams) =>
    queryOptions({
      queryKey: jobKeys.list(params),
      queryFn: ({ signal }) => api.get<Page<JobDto>>("/jobs", { query: params, signal }),
      placeholderData: keepPreviousData,
    }),
  board: () =>
    queryOptions({
      queryKey: jobKeys.board(),
      queryFn: ({ signal }) => api.get<BoardDto>("/jobs/board", { signal }),
      refetchInterval: 60_000,
    }),
  detail: (id: number) =>
    queryOptions({
      queryKey: jobKeys.detail(id),
      queryFn: ({ signal }) => api.get<JobDetailDto>(`/jobs/${id}`, { signal }),
    }),
};

/** After any write to a job: its detail is replaced, every list and the board are refetched. */
function afterJobWrite(queryClient: QueryClient, job?: JobDetailDto) {
  if (job) queryClient.setQueryData(jobKeys.detail(job.id), job);
  return Promise.all([
    queryClient.invalidateQueries({ queryKey: jobKeys.lists() }),
    queryClient.invalidateQueries({ queryKey: jobKeys.board() }),
  ]);
}

export function useCreateJob() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateJobInput) => api.post<JobDetailDto>("/jobs", input),
    onSuccess: (job) => afterJobWrite(queryClient, job),
  });
}

export function useUpdateJob(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateJobInput) => api.patch<JobDetailDto>(`/jobs/${id}`, input),
    onSuccess: (job) => afterJobWrite(queryClient, job),
  });
}

export function useDeleteJob() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api.delete(`/jobs/${id}`),
    // Gone from the cached pages at once, so the table shown next never offers it (or prefetches it) while it
    // refreshes. Its own query is left alone: the screen that showed it stays mounted until the next screen's code
    // has loaded, and removing the query under it would fetch the deleted job again (a 404). Unused, it is
    // garbage-collected like any other.
    onSuccess: (_data, id) => {
      queryClient.setQueriesData<Page<JobDto>>({ queryKey: jobKeys.lists() }, (page) => (page ? { ...page, items: page.items.filter((j) => j.id !== id), total: page.total - (page.items.some((j) => j.id === id) ? 1 : 0) } : page));
      return afterJobWrite(queryClient);
    },
  });
}

export type StageMove = ChangeStageInput & { jobId: number };

/** Moves a job. The board shows the move as soon as the server accepts it, then refetches. */
export function useChangeStage() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ jobId, ...input }: StageMove) => api.post<JobDetailDto>(`/jobs/${jobId}/stage`, input),
    onSuccess: (job) => {
      const boardKey = jobQueries.board().queryKey;
      const board = queryClient.getQueryData(boardKey);
      if (board) queryClient.setQueryData(boardKey, moveOnBoard(board, job.id, job.stage));
      return afterJobWrite(queryClient, job);
    },
  });
}

function moveOnBoard(board: BoardDto, jobId: number, to: Stage): BoardDto {
  const job = board.columns.flatMap((c) => c.jobs).find((j) => j.id === jobId);
  if (!job) return board;
  return {
    columns: board.columns.map((column) => {
      if (column.stage === job.stage)
        return { ...column, total: column.total - 1, jobs: column.jobs.filter((j) => j.id !== jobId) };
      if (column.stage === to) return { ...column, total: column.total + 1, jobs: [{ ...job, stage: to }, ...column.jobs] };
      return column;
    }),
  };
}
