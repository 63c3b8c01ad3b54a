import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { FamilyDetailDto, FamilyInput, FamilySummaryDto, RevisionDiffDto } from "@loopyard/core";
import { apiFetch } from "./client.js";
import { queryKeys } from "./query-keys.js";

const familiesPath = (slug: string) => `/workspaces/${encodeURIComponent(slug)}/families`;

/** GET /api/workspaces/:slug/families — the saved families of the library. */
export function useFamilies(slug: string) {
  return useQuery({
    queryKey: queryKeys.families(slug),
    queryFn: () => apiFetch<FamilySummaryDto[]>(familiesPath(slug)),
  });
}

/** GET /api/workspaces/:slug/families/:familyId[?revision=N]; disabled until a family id is known. */
export function useFamily(slug: string, familyId: string | undefined, revision?: number) {
  return useQuery({
    queryKey: queryKeys.family(slug, familyId ?? "", revision),
    queryFn: () =>
      apiFetch<FamilyDetailDto>(`${familiesPath(slug)}/${encodeURIComponent(familyId ?? "")}${revision === undefined ? "" : `?revision=${revision}`}`),
    enabled: Boolean(familyId),
  });
}

/** GET …/families/:familyId/diff?from=A&to=B: what changed between two revisions. */
export function useFamilyDiff(slug: string, familyId: string, from: number, to: number) {
  return useQuery({
    queryKey: queryKeys.familyDiff(slug, familyId, from, to),
    queryFn: () => apiFetch<RevisionDiffDto>(`${familiesPath(slug)}/${encodeURIComponent(familyId)}/diff?from=${from}&to=${to}`),
    enabled: Boolean(familyId) && from >= 1 && to >= 1,
  });
}

/** POST /api/workspaces/:slug/families (engineer+): a new family with its revision 1. */
export function useCreateFamily(slug: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: FamilyInput) => apiFetch<FamilyDetailDto>(familiesPath(slug), { method: "POST", body: input }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.workspace(slug) }),
  });
}

/** POST …/families/:familyId/revisions (engineer+): a new immutable revision with its change note. */
export function useReviseFamily(slug: string, familyId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: FamilyInput) =>
      apiFetch<FamilyDetailDto>(`${familiesPath(slug)}/${encodeURIComponent(familyId)}/revisions`, { method: "POST", body: input }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.workspace(slug) }),
  });
}

/** POST …/families/:familyId/archive or …/restore (engineer+). */
export function useArchiveFamily(slug: string, familyId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (archive: boolean) =>
      apiFetch<FamilyDetailDto>(`${familiesPath(slug)}/${encodeURIComponent(familyId)}/${archive ? "archive" : "restore"}`, { method: "POST", body: {} }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.workspace(slug) }),
  });
}
