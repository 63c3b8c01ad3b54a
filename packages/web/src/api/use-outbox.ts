import { useQuery } from "@tanstack/react-query";
import type { OutboxDto, OutboxMessageDto } from "@loopyard/core";
import { apiFetch } from "./client.js";
import { queryKeys } from "./query-keys.js";

/** How often the outbox looks for new mail while open [ms]. */
const OUTBOX_REFRESH_MS = 10_000;

/** GET /api/workspaces/:slug/outbox — what the local mail sink received about the workspace (admins). */
export function useOutbox(slug: string) {
  return useQuery({
    queryKey: queryKeys.outbox(slug),
    queryFn: () => apiFetch<OutboxDto>(`/workspaces/${encodeURIComponent(slug)}/outbox`),
    refetchInterval: OUTBOX_REFRESH_MS,
  });
}

/** GET /api/workspaces/:slug/outbox/:id — one message with its text and HTML parts; off until an id is chosen. */
export function useOutboxMessage(slug: string, id: string | null) {
  return useQuery({
    queryKey: queryKeys.outboxMessage(slug, id ?? ""),
    queryFn: () => apiFetch<OutboxMessageDto>(`/workspaces/${encodeURIComponent(slug)}/outbox/${encodeURIComponent(id ?? "")}`),
    enabled: id !== null,
    staleTime: Infinity,
  });
}
