import { useQuery } from "@tanstack/react-query";
import type { DeploymentSheetDto } from "@loopyard/core";
import type { SheetSettings } from "../features/deployment/sheet-settings.js";
import { sheetQuery } from "../features/deployment/sheet-settings.js";
import { apiFetch } from "./client.js";
import { queryKeys } from "./query-keys.js";

/** GET …/sweeps/:sweepId/candidates/:index/sheet at the chosen sample time, method and format. */
export function useCandidateSheet(slug: string, sweepId: string, index: number, settings: SheetSettings) {
  return useQuery({
    queryKey: queryKeys.sheet(slug, sweepId, index, settings.sampleTime, settings.method, settings.format ?? "none"),
    queryFn: () =>
      apiFetch<DeploymentSheetDto>(`/workspaces/${encodeURIComponent(slug)}/sweeps/${encodeURIComponent(sweepId)}/candidates/${index}/sheet?${sheetQuery(settings)}`),
    staleTime: Infinity,
    retry: false,
  });
}
