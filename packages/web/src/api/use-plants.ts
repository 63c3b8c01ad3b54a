import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { PlantDetailDto, PlantInput, PlantSummaryDto } from "@loopyard/core";
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
