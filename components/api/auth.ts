// Who is signed in, and the account actions. The session lives in an httpOnly cookie the app
// never reads; the token in the answers is for scripts and is ignored here.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { ChangePassword, Me, RequestReset, ResetPassword, SessionAnswer, SignIn, SignUp } from '../../shared/schemas/auth';
import { api, ApiError } from './client';

export const authKeys = {
  all: ['account'] as const,
  me: () => [...authKeys.all, 'me'] as const,
};

/** The signed-in person and their shops; `null` when nobody is signed in, undefined while loading. */
export function useMe() {
  return useQuery({
    queryKey: authKeys.me(),
    queryFn: async ({ signal }) => {
      try {
        return await api<Me>('/me', { signal });
      } catch (e) {
        if (e instanceof ApiError && e.status === 401) return null;
        throw e;
      }
    },
    staleTime: 30_000,
  });
}

/** After signing in or out every cached answer belonged to someone else: start over. */
function useFreshStart() {
  const qc = useQueryClient();
  return () => qc.resetQueries();
}

export function useSignIn() {
  const fresh = useFreshStart();
  return useMutation({
    mutationFn: (body: SignIn) => api<SessionAnswer>('/auth/sign-in', { method: 'POST', json: body }),
    onSuccess: fresh,
  });
}

export function useSignUp() {
  const fresh = useFreshStart();
  return useMutation({
    mutationFn: (body: SignUp) => api<SessionAnswer>('/auth/sign-up', { method: 'POST', json: body }),
    onSuccess: fresh,
  });
}

export function useSignOut() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api<null>('/auth/sign-out', { method: 'POST' }),
    onSettled: () => {
      qc.clear();
      qc.setQueryData(authKeys.me(), null);
    },
  });
}

/** Ends the account's sessions on every other browser and device; this one stays signed in. */
export function useSignOutOthers() {
  return useMutation({ mutationFn: () => api<{ ended: number }>('/auth/sign-out-others', { method: 'POST' }) });
}

export function useChangePassword() {
  return useMutation({ mutationFn: (body: ChangePassword) => api<null>('/auth/password', { method: 'POST', json: body }) });
}

export function useRequestReset() {
  return useMutation({ mutationFn: (body: RequestReset) => api<{ message: string }>('/auth/reset-request', { method: 'POST', json: body }) });
}

export function useResetPassword() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: ResetPassword) => api<{ message: string }>('/auth/reset', { method: 'POST', json: body }),
    // Every session of that account has ended, this browser's too.
    onSuccess: () => {
      qc.clear();
      qc.setQueryData(authKeys.me(), null);
    },
  });
}
