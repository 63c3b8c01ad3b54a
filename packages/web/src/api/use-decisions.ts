import { keepPreviousData, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { DecisionDetailDto, DecisionListItemDto, DecisionProposalInput, DecisionState, DecisionWaitingDto } from "@loopyard/core";
import { apiFetch } from "./client.js";
import { queryKeys } from "./query-keys.js";

const decisionsPath = (slug: string) => `/workspaces/${encodeURIComponent(slug)}/decisions`;

/** The address of a decision (under /api) and of its exports: record.json, record.pdf, the deployment sheet. */
export const decisionPath = (slug: string, id: string) => `${decisionsPath(slug)}/${encodeURIComponent(id)}`;

/** GET …/decisions?state=&family= — newest first, filtered by state and family ("" for any). */
export function useDecisions(slug: string, state: DecisionState | "", family: string) {
  const query = new URLSearchParams();
  if (state) query.set("state", state);
  if (family) query.set("family", family);
  const search = query.toString();
  return useQuery({
    queryKey: queryKeys.decisionList(slug, state, family),
    queryFn: () => apiFetch<DecisionListItemDto[]>(`${decisionsPath(slug)}${search ? `?${search}` : ""}`),
    placeholderData: keepPreviousData,
  });
}

/** GET …/decisions/waiting — proposals a lead may approve, and the caller's own proposals returned to them. */
export function useWaitingDecisions(slug: string) {
  return useQuery({
    queryKey: queryKeys.decisionsWaiting(slug),
    queryFn: () => apiFetch<DecisionWaitingDto>(`${decisionsPath(slug)}/waiting`),
  });
}

/** GET …/decisions/:id — the record, the thread, the audit trail and what the caller may do. */
export function useDecision(slug: string, id: string) {
  return useQuery({
    queryKey: queryKeys.decision(slug, id),
    queryFn: () => apiFetch<DecisionDetailDto>(decisionPath(slug, id)),
    enabled: id !== "",
  });
}

/** After any change: the decision's own cache from the answer, every list and the waiting card refetched. */
function useDecisionChange<TArg>(slug: string, call: (arg: TArg) => Promise<DecisionDetailDto>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: call,
    onSuccess: (detail) => {
      queryClient.setQueryData(queryKeys.decision(slug, detail.id), detail);
      return queryClient.invalidateQueries({ queryKey: queryKeys.decisions(slug), predicate: (q) => q.queryKey[3] !== "one" || q.queryKey[4] !== detail.id });
    },
  });
}

/** POST …/decisions (engineer+): propose a design with a title and a rationale. */
export function useProposeDecision(slug: string) {
  return useDecisionChange(slug, (body: DecisionProposalInput) => apiFetch<DecisionDetailDto>(decisionsPath(slug), { method: "POST", body }));
}

/** PUT …/decisions/:id (the proposer): revise a returned proposal; it is proposed again. */
export function useReviseDecision(slug: string, id: string) {
  return useDecisionChange(slug, (body: DecisionProposalInput) => apiFetch<DecisionDetailDto>(decisionPath(slug, id), { method: "PUT", body }));
}

/** POST …/decisions/:id/approve (a lead who may). */
export function useApproveDecision(slug: string, id: string) {
  return useDecisionChange(slug, () => apiFetch<DecisionDetailDto>(`${decisionPath(slug, id)}/approve`, { method: "POST" }));
}

/** POST …/decisions/:id/return with { comment } (a lead). */
export function useReturnDecision(slug: string, id: string) {
  return useDecisionChange(slug, (comment: string) => apiFetch<DecisionDetailDto>(`${decisionPath(slug, id)}/return`, { method: "POST", body: { comment } }));
}

/** POST …/decisions/:id/comments with { comment }. */
export function useCommentOnDecision(slug: string, id: string) {
  return useDecisionChange(slug, (comment: string) => apiFetch<DecisionDetailDto>(`${decisionPath(slug, id)}/comments`, { method: "POST", body: { comment } }));
}

/** POST …/decisions/:id/withdraw (the proposer, a lead or an admin). */
export function useWithdrawDecision(slug: string, id: string) {
  return useDecisionChange(slug, () => apiFetch<DecisionDetailDto>(`${decisionPath(slug, id)}/withdraw`, { method: "POST" }));
}
