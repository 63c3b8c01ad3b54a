import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { AuditEventDto, InvitationDto, InvitationInput, MemberDto, MemberListDto, Role } from "@loopyard/core";
import { apiFetch } from "./client.js";
import { queryKeys } from "./query-keys.js";

const path = (slug: string, rest: string) => `/workspaces/${encodeURIComponent(slug)}/${rest}`;

/** GET /members — every member with role and joining date (any member may read it). */
export function useMembers(slug: string) {
  return useQuery({ queryKey: queryKeys.members(slug), queryFn: () => apiFetch<MemberListDto>(path(slug, "members")) });
}

/** GET /invitations — the pending invitations (admins only: `enabled` false for the others). */
export function useInvitations(slug: string, enabled: boolean) {
  return useQuery({ queryKey: queryKeys.invitations(slug), queryFn: () => apiFetch<InvitationDto[]>(path(slug, "invitations")), enabled });
}

/** GET /audit — the workspace's audit trail, newest first (admins only). */
export function useAuditTrail(slug: string, enabled: boolean) {
  return useQuery({ queryKey: queryKeys.audit(slug), queryFn: () => apiFetch<AuditEventDto[]>(path(slug, "audit")), enabled });
}

/** After any membership change: the member list, the invitations, the trail and the workspace home read afresh. */
function useRefreshMembers(slug: string) {
  const queryClient = useQueryClient();
  return () => queryClient.invalidateQueries({ queryKey: queryKeys.workspace(slug) });
}

export function useInvite(slug: string) {
  const refresh = useRefreshMembers(slug);
  return useMutation({
    mutationFn: (input: InvitationInput) => apiFetch<InvitationDto>(path(slug, "invitations"), { method: "POST", body: input }),
    onSuccess: refresh,
  });
}

export function useResendInvitation(slug: string) {
  const refresh = useRefreshMembers(slug);
  return useMutation({
    mutationFn: (id: string) => apiFetch<InvitationDto>(path(slug, `invitations/${encodeURIComponent(id)}/resend`), { method: "POST", body: {} }),
    onSuccess: refresh,
  });
}

export function useRevokeInvitation(slug: string) {
  const refresh = useRefreshMembers(slug);
  return useMutation({
    mutationFn: (id: string) => apiFetch<null>(path(slug, `invitations/${encodeURIComponent(id)}/revoke`), { method: "POST", body: {} }),
    onSuccess: refresh,
  });
}

export function useChangeRole(slug: string) {
  const refresh = useRefreshMembers(slug);
  return useMutation({
    mutationFn: (input: { userId: string; role: Role }) =>
      apiFetch<MemberDto>(path(slug, `members/${encodeURIComponent(input.userId)}`), { method: "PATCH", body: { role: input.role } }),
    onSuccess: refresh,
  });
}

export function useRemoveMember(slug: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (userId: string) => apiFetch<null>(path(slug, `members/${encodeURIComponent(userId)}`), { method: "DELETE" }),
    // Removing oneself changes one's own workspaces too.
    onSuccess: () => Promise.all([queryClient.invalidateQueries({ queryKey: queryKeys.workspace(slug) }), queryClient.invalidateQueries({ queryKey: queryKeys.me })]),
  });
}
