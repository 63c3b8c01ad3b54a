import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { SweepDetailDto, SweepInput, SweepStatus, SweepSummaryDto } from "@loopyard/core";
import { apiFetch } from "./client.js";
import { queryKeys } from "./query-keys.js";

const sweepsPath = (slug: string) => `/workspaces/${encodeURIComponent(slug)}/sweeps`;

/** How often a sweep still in progress is polled [ms]. */
export const SWEEP_POLL_MS = 1000;

export function isSweepActive(status: SweepStatus): boolean {
  return status === "queued" || status === "running";
}

/** GET /api/workspaces/:slug/sweeps — newest first; polls while any sweep is in progress. */
export function useSweeps(slug: string) {
  return useQuery({
    queryKey: queryKeys.sweeps(slug),
    queryFn: () => apiFetch<SweepSummaryDto[]>(sweepsPath(slug)),
    refetchInterval: (query) => (query.state.data?.some((s) => isSweepActive(s.status)) ? SWEEP_POLL_MS : false),
  });
}

/** GET /api/workspaces/:slug/sweeps/:sweepId, as query options (for useSweep and for prefetching). */
export function sweepQuery(slug: string, sweepId: string) {
  return queryOptions({
    queryKey: queryKeys.sweep(slug, sweepId),
    queryFn: () => apiFetch<SweepDetailDto>(`${sweepsPath(slug)}/${encodeURIComponent(sweepId)}`),
  });
}

/** GET /api/workspaces/:slug/sweeps/:sweepId — polls every second while queued or running. */
export function useSweep(slug: string, sweepId: string, enabled = true) {
  return useQuery({
    ...sweepQuery(slug, sweepId),
    enabled: enabled && sweepId !== "",
    refetchInterval: (query) => (query.state.data && isSweepActive(query.state.data.status) ? SWEEP_POLL_MS : false),
  });
}

/** POST /api/workspaces/:slug/sweeps (engineer+): starts the sweep in the background. */
export function useCreateSweep(slug: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SweepInput) => apiFetch<SweepDetailDto>(sweepsPath(slug), { method: "POST", body: input }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.workspace(slug) }),
  });
}

/** POST /api/workspaces/:slug/sweeps/:sweepId/cancel (engineer+): no more chunks are handed out; running ones finish. */
export function useCancelSweep(slug: string, sweepId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => apiFetch<SweepDetailDto>(`${sweepsPath(slug)}/${encodeURIComponent(sweepId)}/cancel`, { method: "POST" }),
    onSuccess: (detail) => {
      queryClient.setQueryData(queryKeys.sweep(slug, sweepId), detail);
      return queryClient.invalidateQueries({ queryKey: queryKeys.sweeps(slug) });
    },
  });
}
