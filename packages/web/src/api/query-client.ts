import { QueryClient } from "@tanstack/react-query";
import { isApiError } from "./api-error.js";

/** Retries only what may succeed on a second try: network failures and 5xx, twice. */
export function createQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: {
        staleTime: 10_000,
        refetchOnWindowFocus: false,
        retry: (failureCount, error) =>
          failureCount < 2 && (!isApiError(error) || error.status === 0 || error.status >= 500),
      },
    },
  });
}
