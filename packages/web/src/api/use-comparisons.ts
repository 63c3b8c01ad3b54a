import { keepPreviousData, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { ComparisonAcrossDto, ComparisonDetailDto, ComparisonResponsesDto, ComparisonStatus, ComparisonSummaryDto } from "@loopyard/core";
import type { ComparisonResultJson } from "../features/comparisons/comparison-result-types.js";
import { apiFetch } from "./client.js";
import { queryKeys } from "./query-keys.js";

const comparisonsPath = (slug: string) => `/workspaces/${encodeURIComponent(slug)}/comparisons`;
const comparisonPath = (slug: string, id: string) => `${comparisonsPath(slug)}/${encodeURIComponent(id)}`;

/** How often a comparison still in progress is polled [ms]. */
export const COMPARISON_POLL_MS = 1000;

export function isComparisonActive(status: ComparisonStatus): boolean {
  return status === "queued" || status === "running";
}

/** GET /api/workspaces/:slug/comparisons — newest first; polls while any is in progress. */
export function useComparisons(slug: string) {
  return useQuery({
    queryKey: queryKeys.comparisons(slug),
    queryFn: () => apiFetch<ComparisonSummaryDto[]>(comparisonsPath(slug)),
    refetchInterval: (query) => (query.state.data?.some((c) => isComparisonActive(c.status)) ? COMPARISON_POLL_MS : false),
  });
}

/** GET …/comparisons/:id — polls every second while queued or running. */
export function useComparison(slug: string, id: string) {
  return useQuery({
    queryKey: queryKeys.comparison(slug, id),
    queryFn: () => apiFetch<ComparisonDetailDto>(comparisonPath(slug, id)),
    enabled: id !== "",
    refetchInterval: (query) => (query.state.data && isComparisonActive(query.state.data.status) ? COMPARISON_POLL_MS : false),
  });
}

/** GET …/comparisons/:id/result — once the comparison has finished (it never changes afterwards). */
export function useComparisonResult(slug: string, id: string, finished: boolean) {
  return useQuery({
    queryKey: queryKeys.comparisonResult(slug, id),
    queryFn: () => apiFetch<ComparisonResultJson>(`${comparisonPath(slug, id)}/result`),
    enabled: finished,
    staleTime: Infinity,
  });
}

/** GET …/comparisons/:id/responses?variant=k — every pick's y(t), u(t) and |S(jω)| on variant k (null: each pick's worst variant). */
export function usePickResponses(slug: string, id: string, variant: number | null, enabled: boolean) {
  return useQuery({
    queryKey: queryKeys.comparisonResponses(slug, id, variant),
    queryFn: () => apiFetch<ComparisonResponsesDto>(`${comparisonPath(slug, id)}/responses${variant === null ? "" : `?variant=${variant}`}`),
    enabled,
    staleTime: Infinity,
    placeholderData: keepPreviousData,
  });
}

/** GET …/comparisons/across?judge=key — finished comparisons lined up by contender. */
export function useComparisonsAcross(slug: string, judge: string) {
  return useQuery({
    queryKey: queryKeys.comparisonsAcross(slug, judge),
    queryFn: () => apiFetch<ComparisonAcrossDto>(`${comparisonsPath(slug)}/across${judge === "" ? "" : `?judge=${encodeURIComponent(judge)}`}`),
    placeholderData: keepPreviousData,
  });
}

/** POST …/comparisons (engineer+): stores the comparison and starts its jobs. */
export function useCreateComparison(slug: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: unknown) => apiFetch<ComparisonDetailDto>(comparisonsPath(slug), { method: "POST", body: input }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.comparisons(slug) }),
  });
}

/** POST …/comparisons/:id/cancel (engineer+). */
export function useCancelComparison(slug: string, id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => apiFetch<ComparisonDetailDto>(`${comparisonPath(slug, id)}/cancel`, { method: "POST" }),
    onSuccess: (detail) => {
      queryClient.setQueryData(queryKeys.comparison(slug, id), detail);
      return queryClient.invalidateQueries({ queryKey: queryKeys.comparisons(slug) });
    },
  });
}
