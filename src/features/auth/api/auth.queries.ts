import { queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import { api, isApiError } from "@/lib/api-client";
import type {
  ChangePasswordInput,
  PasswordResetConfirm,
  PasswordResetRequest,
  SessionUser,
  SignInInput,
} from "@shared/schemas/auth.schema";

type Message = { message: string };

export const authKeys = {
  all: ["auth"] as const,
  me: () => [...authKeys.all, "me"] as const,
};

/** The signed-in user, or null when signed out (the API answers 401). */
async function getMe({ signal }: { signal?: AbortSignal }): Promise<SessionUser | null> {
  try {
    return await api.get<SessionUser>("/auth/me", { signal });
  } catch (error) {
    if (isApiError(error) && error.status === 401) return null;
    throw error;
  }
}

export const authQueries = {
  me: () =>
    queryOptions({
      queryKey: authKeys.me(),
      queryFn: getMe,
      staleTime: 5 * 60_000,
      retry: false,
    }),
};

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SignInInput) => api.post<SessionUser>("/auth/sign-in", input),
    onSuccess: (user) => {
      // Nothing cached for a previous user may leak into this session.
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== authKeys.all[0] });
      queryClient.setQueryData(authKeys.me(), user);
    },
  });
}

/** Ends the session on the server. The caller then reloads into the sign-in page, which drops every cached record. */
export function useSignOut() {
  return useMutation({
    mutationFn: () => api.post<void>("/auth/sign-out"),
  });
}

export function useRequestPasswordReset() {
  return useMutation({
    mutationFn: (input: PasswordResetRequest) => api.post<Message>("/auth/password-reset", input),
  });
}

export function useConfirmPasswordReset() {
  return useMutation({
    mutationFn: (input: PasswordResetConfirm) => api.post<Message>("/auth/password-reset/confirm", input),
  });
}

export function useChangePassword() {
  return useMutation({
    mutationFn: (input: ChangePasswordInput) => api.post<Message>("/auth/password", input),
  });
}
