import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { PlantDetailDto, PlantInput, PlantSummaryDto, RevisionDiffDto } from "@loopyard/core";
import { apiFetch } from "./client.js";
import { queryKeys } from "./query-keys.js";

const plantsPath = (slug: string) => `/workspaces/${encodeURIComponent(slug)}/plants`;

/** GET /api/workspaces/:slug/plants — the library. */
export function usePlants(slug: string) {
  return useQuery({
    queryKey: queryKeys.plants(slug),
    queryFn: () => apiFetch<PlantSummaryDto[]>(plantsPath(slug)),
  });
}

/** GET /api/workspaces/:slug/plants/:plantId[?revision=N]; disabled until a plant id is known. */
export function usePlant(slug: string, plantId: string | undefined, revision?: number) {
  return useQuery({
    queryKey: queryKeys.plant(slug, plantId ?? "", revision),
    queryFn: () =>
      apiFetch<PlantDetailDto>(
        `${plantsPath(slug)}/${encodeURIComponent(plantId ?? "")}${revision === undefined ? "" : `?revision=${revision}`}`,
      ),
    enabled: Boolean(plantId),
  });
}

/** POST /api/workspaces/:slug/plants (engineer+). */
export function useCreatePlant(slug: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: PlantInput) => apiFetch<PlantDetailDto>(plantsPath(slug), { method: "POST", body: input }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.workspace(slug) }),
  });
}

/** POST /api/workspaces/:slug/plants/:plantId/revisions (engineer+): a new immutable revision. */
export function useCreateRevision(slug: string, plantId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: PlantInput) =>
      apiFetch<PlantDetailDto>(`${plantsPath(slug)}/${encodeURIComponent(plantId)}/revisions`, { method: "POST", body: input }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.workspace(slug) }),
  });
}

/** GET /api/workspaces/:slug/plants/:plantId/diff?from=A&to=B: what changed between two revisions. */
export function usePlantDiff(slug: string, plantId: string, from: number, to: number) {
  return useQuery({
    queryKey: [...queryKeys.plants(slug), plantId, "diff", from, to] as const,
    queryFn: () => apiFetch<RevisionDiffDto>(`${plantsPath(slug)}/${encodeURIComponent(plantId)}/diff?from=${from}&to=${to}`),
    enabled: Boolean(plantId) && from >= 1 && to >= 1,
  });
}

/** POST …/plants/:plantId/archive or …/restore (engineer+): hide a plant from the pickers, or bring it back. */
export function useArchivePlant(slug: string, plantId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (archive: boolean) =>
      apiFetch<PlantDetailDto>(`${plantsPath(slug)}/${encodeURIComponent(plantId)}/${archive ? "archive" : "restore"}`, { method: "POST", body: {} }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.workspace(slug) }),
  });
}
