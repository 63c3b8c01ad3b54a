import { useMutation, useQueryClient } from "@tanstack/react-query";
import { apiFetch } from "./client.js";

export interface SignInInput {
  email: string;
  password: string;
}

export interface SignUpInput extends SignInInput {
  name: string;
}

/** POST /api/auth/sign-in/email; on success every cached query is dropped so the new session reads afresh. */
export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SignInInput) => apiFetch<unknown>("/auth/sign-in/email", { method: "POST", body: input }),
    onSuccess: () => queryClient.clear(),
  });
}

/**
 * POST /api/auth/sign-up/email, then sign in with the same address and password: sign-up alone
 * starts no session (the server answers a taken address like a fresh one, so as not to tell who
 * has an account).
 */
export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (input: SignUpInput) => {
      await apiFetch<unknown>("/auth/sign-up/email", { method: "POST", body: input });
      return apiFetch<unknown>("/auth/sign-in/email", { method: "POST", body: { email: input.email, password: input.password } });
    },
    onSuccess: () => queryClient.clear(),
  });
}

/** POST /api/auth/sign-out, then forget everything cached for the old session. */
export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => apiFetch<unknown>("/auth/sign-out", { method: "POST", body: {} }),
    onSettled: () => queryClient.clear(),
  });
}
