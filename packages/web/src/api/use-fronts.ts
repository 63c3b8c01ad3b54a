import { queryOptions, useQuery } from "@tanstack/react-query";
import type { CandidateDto, CriterionId, FrontDto, ResponseDto } from "@loopyard/core";
import { apiFetch } from "./client.js";
import { fetchPoints } from "./fetch-points.js";
import { queryKeys } from "./query-keys.js";

const sweepPath = (slug: string, sweepId: string) =>
  `/workspaces/${encodeURIComponent(slug)}/sweeps/${encodeURIComponent(sweepId)}`;

/** GET …/sweeps/:sweepId/points?x=&y=, as query options (for usePoints and for prefetching). */
export function pointsQuery(slug: string, sweepId: string, x: CriterionId, y: CriterionId) {
  return queryOptions({
    queryKey: queryKeys.points(slug, sweepId, x, y),
    // Off the page's thread: the page is busy evaluating the plotting bundle while these megabytes arrive.
    queryFn: () => fetchPoints(`${sweepPath(slug, sweepId)}/points?x=${x}&y=${y}`),
    staleTime: Infinity,
  });
}

/** GET …/sweeps/:sweepId/points?x=&y= — the chart's cloud in columns (rounded for drawing); only once the sweep finished. */
export function usePoints(slug: string, sweepId: string, x: CriterionId, y: CriterionId, enabled: boolean) {
  return useQuery({
    ...pointsQuery(slug, sweepId, x, y),
    enabled,
    // Keep the cloud on screen while other axes load.
    placeholderData: (previous) => previous,
  });
}

/** GET …/sweeps/:sweepId/candidates/:index — one candidate in full, with its per-variant scores. */
export function useCandidate(slug: string, sweepId: string, index: number | null, enabled = true) {
  return useQuery({
    queryKey: queryKeys.candidate(slug, sweepId, index ?? -1),
    queryFn: () => apiFetch<CandidateDto>(`${sweepPath(slug, sweepId)}/candidates/${index}`),
    enabled: enabled && index !== null,
    staleTime: Infinity,
  });
}

/** GET …/sweeps/:sweepId/front?x=&y=, as query options (for useFront and for prefetching). */
export function frontQuery(slug: string, sweepId: string, x: CriterionId, y: CriterionId) {
  return queryOptions({
    queryKey: queryKeys.front(slug, sweepId, x, y),
    queryFn: () => apiFetch<FrontDto>(`${sweepPath(slug, sweepId)}/front?x=${x}&y=${y}`),
    staleTime: Infinity,
  });
}

/** GET …/sweeps/:sweepId/front?x=&y= — the non-dominated candidates for two criteria (indices and the candidates in full). */
export function useFront(slug: string, sweepId: string, x: CriterionId, y: CriterionId, enabled: boolean) {
  return useQuery({ ...frontQuery(slug, sweepId, x, y), enabled });
}

/** The query string choosing a variant of the family: none for the first (the server's default). */
export function variantQuery(variant: number): string {
  return variant === 0 ? "" : `?variant=${variant}`;
}

/** GET …/candidates/:index/response[?variant=k] — the closed-loop response on one variant (0, the first, by default), simulated on demand. */
export function useCandidateResponse(slug: string, sweepId: string, index: number | null, variant = 0) {
  return useQuery({
    queryKey: queryKeys.response(slug, sweepId, index ?? -1, variant),
    queryFn: () => apiFetch<ResponseDto>(`${sweepPath(slug, sweepId)}/candidates/${index}/response${variantQuery(variant)}`),
    enabled: index !== null,
    staleTime: Infinity,
  });
}
