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

/** POST /api/auth/sign-up/email; better-auth signs the new user in. */
export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SignUpInput) => apiFetch<unknown>("/auth/sign-up/email", { method: "POST", body: input }),
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
