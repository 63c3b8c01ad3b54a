import { useMutation, useQueryClient } from "@tanstack/react-query";
import { apiFetch } from "./client.js";
import { queryKeys } from "./query-keys.js";

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

/** POST /api/auth/request-password-reset — answers the same whether or not the address has an account. */
export function useRequestPasswordReset() {
  return useMutation({
    mutationFn: (email: string) => apiFetch<unknown>("/auth/request-password-reset", { method: "POST", body: { email, redirectTo: "/reset-password" } }),
  });
}

/** POST /api/auth/reset-password with the token from the mailed link; ends every session of the account. */
export function useResetPassword() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: { token: string; newPassword: string }) => apiFetch<unknown>("/auth/reset-password", { method: "POST", body: input }),
    onSuccess: () => queryClient.clear(),
  });
}

/** GET /api/auth/verify-email with the token from the mailed link (the server redacts it from its log). */
export function useVerifyEmail() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (token: string) => apiFetch<unknown>(`/auth/verify-email?token=${encodeURIComponent(token)}`),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.me }),
  });
}

/** POST /api/auth/send-verification-email — mails the address check again to the signed-in account. */
export function useSendVerificationEmail() {
  return useMutation({ mutationFn: (email: string) => apiFetch<unknown>("/auth/send-verification-email", { method: "POST", body: { email } }) });
}
