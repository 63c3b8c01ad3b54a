import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { NotificationSettingsDto, NotificationSettingsInput } from "@loopyard/core";
import { apiFetch } from "./client.js";
import { queryKeys } from "./query-keys.js";

/** GET /api/me/notifications — which kinds of mail the signed-in person gets. */
export function useNotificationSettings() {
  return useQuery({
    queryKey: queryKeys.notifications,
    queryFn: () => apiFetch<NotificationSettingsDto>("/me/notifications"),
  });
}

/**
 * PUT /api/me/notifications — turn kinds on or off. The switch moves at once (the cached settings
 * change before the answer) and moves back if the server refuses; the answer replaces the cache.
 */
export function useUpdateNotificationSettings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: NotificationSettingsInput) => apiFetch<NotificationSettingsDto>("/me/notifications", { method: "PUT", body: input }),
    onMutate: async (input) => {
      await queryClient.cancelQueries({ queryKey: queryKeys.notifications });
      const before = queryClient.getQueryData<NotificationSettingsDto>(queryKeys.notifications);
      if (before) {
        const wanted = new Map(input.settings.map((s) => [s.kind, s.enabled]));
        queryClient.setQueryData<NotificationSettingsDto>(queryKeys.notifications, {
          ...before,
          settings: before.settings.map((s) => (wanted.has(s.kind) && !s.locked ? { ...s, enabled: wanted.get(s.kind) as boolean } : s)),
        });
      }
      return { before };
    },
    onError: (_error, _input, context) => {
      if (context?.before) queryClient.setQueryData(queryKeys.notifications, context.before);
    },
    onSuccess: (data) => queryClient.setQueryData(queryKeys.notifications, data),
  });
}
