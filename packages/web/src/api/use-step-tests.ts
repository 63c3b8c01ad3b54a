import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { PlantDetailDto, RefitInput, StepTestDto, StepTestFitInput, StepTestFitReport, StepTestPlantInput } from "@loopyard/core";
import { apiFetch, apiUpload } from "./client.js";
import { queryKeys } from "./query-keys.js";

const stepTestsPath = (slug: string) => `/workspaces/${encodeURIComponent(slug)}/step-tests`;

/** POST /api/workspaces/:slug/step-tests (engineer+): uploads a CSV or TSV; answers its columns and preview. */
export function useUploadStepTest(slug: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (file: File) => apiUpload<StepTestDto>(stepTestsPath(slug), file),
    onSuccess: (stored) => queryClient.setQueryData(queryKeys.stepTest(slug, stored.id), stored),
  });
}

/** GET /api/workspaces/:slug/step-tests/:stepTestId; disabled until the id is known. */
export function useStepTest(slug: string, id: string | undefined) {
  return useQuery({
    queryKey: queryKeys.stepTest(slug, id ?? ""),
    queryFn: () => apiFetch<StepTestDto>(`${stepTestsPath(slug)}/${encodeURIComponent(id ?? "")}`),
    enabled: Boolean(id),
  });
}

/** POST …/step-tests/:stepTestId/fits: the three models fitted with the chosen settings. */
export function useFitStepTest(slug: string, id: string) {
  return useMutation({
    mutationFn: (input: StepTestFitInput) => apiFetch<StepTestFitReport>(`${stepTestsPath(slug)}/${encodeURIComponent(id)}/fits`, { method: "POST", body: input }),
  });
}

/** POST …/step-tests/:stepTestId/plants: a fit saved as a new identified plant. */
export function useSaveIdentifiedPlant(slug: string, id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: StepTestPlantInput) => apiFetch<PlantDetailDto>(`${stepTestsPath(slug)}/${encodeURIComponent(id)}/plants`, { method: "POST", body: input }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.workspace(slug) }),
  });
}

/** POST /api/workspaces/:slug/plants/:plantId/refit: the identified plant fitted again, as a new revision. */
export function useRefitPlant(slug: string, plantId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: RefitInput) =>
      apiFetch<PlantDetailDto>(`/workspaces/${encodeURIComponent(slug)}/plants/${encodeURIComponent(plantId)}/refit`, { method: "POST", body: input }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.workspace(slug) }),
  });
}
