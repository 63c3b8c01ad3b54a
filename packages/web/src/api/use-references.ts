import { queryOptions, useQuery } from "@tanstack/react-query";
import type { FrequencyDto, ReferencesDto } from "@loopyard/core";
import { apiFetch } from "./client.js";
import { queryKeys } from "./query-keys.js";
import { variantQuery } from "./use-fronts.js";

const sweepPath = (slug: string, sweepId: string) =>
  `/workspaces/${encodeURIComponent(slug)}/sweeps/${encodeURIComponent(sweepId)}`;

/** GET …/sweeps/:sweepId/references, as query options (for useReferences and for prefetching). */
export function referencesQuery(slug: string, sweepId: string) {
  return queryOptions({
    queryKey: [...queryKeys.sweep(slug, sweepId), "references"] as const,
    queryFn: () => apiFetch<ReferencesDto>(`${sweepPath(slug, sweepId)}/references`),
    staleTime: Infinity,
  });
}

/** GET …/sweeps/:sweepId/references — the bound curve and the scored tuning-rule baselines. */
export function useReferences(slug: string, sweepId: string, enabled: boolean) {
  return useQuery({ ...referencesQuery(slug, sweepId), enabled });
}

/**
 * GET …/candidates/:index/frequency[?variant=k] — |S|, |T| (and 1/|W|) of one candidate's loop on one
 * variant of the family (0, the first, by default); linear plants only.
 */
export function useCandidateFrequency(slug: string, sweepId: string, index: number | null, enabled: boolean, variant = 0) {
  return useQuery({
    queryKey: [...queryKeys.sweep(slug, sweepId), "frequency", index ?? -1, variant] as const,
    queryFn: () => apiFetch<FrequencyDto>(`${sweepPath(slug, sweepId)}/candidates/${index}/frequency${variantQuery(variant)}`),
    enabled: enabled && index !== null,
    staleTime: Infinity,
  });
}
