import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { WorkspaceDto, WorkspaceHomeDto } from "@loopyard/core";
import { apiFetch } from "./client.js";
import { queryKeys } from "./query-keys.js";

/** GET /api/workspaces/:slug — the workspace, the caller's role, counts, members, recent sweeps. */
export function useWorkspace(slug: string) {
  return useQuery({
    queryKey: queryKeys.workspace(slug),
    queryFn: () => apiFetch<WorkspaceHomeDto>(`/workspaces/${encodeURIComponent(slug)}`),
  });
}

/** POST /api/workspaces — the creator becomes its admin. */
export function useCreateWorkspace() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: { name: string }) => apiFetch<WorkspaceDto>("/workspaces", { method: "POST", body: input }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.me }),
  });
}
