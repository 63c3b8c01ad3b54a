import { useQuery } from "@tanstack/react-query";
import type { MeDto } from "@loopyard/core";
import { apiFetch } from "./client.js";
import { queryKeys } from "./query-keys.js";

/** The signed-in user and their workspaces; fails with status 401 when signed out. */
export function useMe() {
  return useQuery({
    queryKey: queryKeys.me,
    queryFn: () => apiFetch<MeDto>("/me"),
    retry: false,
    staleTime: 60_000,
  });
}
