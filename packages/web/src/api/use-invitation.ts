import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { InvitationAcceptedDto, InvitationPreviewDto } from "@loopyard/core";
import { apiFetch } from "./client.js";
import { queryKeys } from "./query-keys.js";

/** POST /api/invitations/preview — what an invitation link offers the signed-in account (the token stays out of URLs). */
export function useInvitationPreview(token: string, enabled: boolean) {
  return useQuery({
    queryKey: ["invitation", token] as const,
    queryFn: () => apiFetch<InvitationPreviewDto>("/invitations/preview", { method: "POST", body: { token } }),
    enabled,
    retry: false,
  });
}

/** POST /api/invitations/accept — joins the workspace; the list of workspaces reads afresh. */
export function useAcceptInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (token: string) => apiFetch<InvitationAcceptedDto>("/invitations/accept", { method: "POST", body: { token } }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.me }),
  });
}

/** POST /api/invitations/decline */
export function useDeclineInvitation() {
  return useMutation({ mutationFn: (token: string) => apiFetch<null>("/invitations/decline", { method: "POST", body: { token } }) });
}
