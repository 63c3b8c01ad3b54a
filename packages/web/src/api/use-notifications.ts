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

/** PUT /api/me/notifications — turn kinds on or off; answers the whole new list. */
export function useUpdateNotificationSettings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: NotificationSettingsInput) => apiFetch<NotificationSettingsDto>("/me/notifications", { method: "PUT", body: input }),
    onSuccess: (data) => queryClient.setQueryData(queryKeys.notifications, data),
  });
}
