import { useQuery } from "@tanstack/react-query";
import type { CandidateListDto, CriterionId, FrontDto, ResponseDto } from "@loopyard/core";
import { apiFetch } from "./client.js";
import { queryKeys } from "./query-keys.js";

const sweepPath = (slug: string, sweepId: string) =>
  `/workspaces/${encodeURIComponent(slug)}/sweeps/${encodeURIComponent(sweepId)}`;

/** GET …/sweeps/:sweepId/candidates — every candidate's parameters and scores; only once the sweep finished. */
export function useCandidates(slug: string, sweepId: string, enabled: boolean) {
  return useQuery({
    queryKey: queryKeys.candidates(slug, sweepId),
    queryFn: () => apiFetch<CandidateListDto>(`${sweepPath(slug, sweepId)}/candidates`),
    enabled,
    staleTime: Infinity,
  });
}

/** GET …/sweeps/:sweepId/front?x=&y= — indices of the non-dominated candidates for two criteria. */
export function useFront(slug: string, sweepId: string, x: CriterionId, y: CriterionId, enabled: boolean) {
  return useQuery({
    queryKey: queryKeys.front(slug, sweepId, x, y),
    queryFn: () => apiFetch<FrontDto>(`${sweepPath(slug, sweepId)}/front?x=${x}&y=${y}`),
    enabled,
    staleTime: Infinity,
  });
}

/** GET …/candidates/:index/response — the closed-loop step response, simulated on demand. */
export function useCandidateResponse(slug: string, sweepId: string, index: number | null) {
  return useQuery({
    queryKey: queryKeys.response(slug, sweepId, index ?? -1),
    queryFn: () => apiFetch<ResponseDto>(`${sweepPath(slug, sweepId)}/candidates/${index}/response`),
    enabled: index !== null,
    staleTime: Infinity,
  });
}
