import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Me, SignInBody } from '@shared/schemas/people';
import { api } from '@/lib/api-client';
import { authKeys } from '@/lib/auth';

export const useSignIn = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: SignInBody) => api<Me>('/auth/login', { body }),
    onSuccess: (me) => {
      qc.clear();
      qc.setQueryData(authKeys.me(), me);
    },
  });
};

/**
 * Signs out. The pages' queries are stopped first, so nothing asks the server after the session is gone; then
 * "nobody" is recorded as the user (the protected route leaves for the sign-in page) and the rest of the cache
 * is dropped once the pages have unmounted.
 */
export const useSignOut = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async () => {
      await qc.cancelQueries({ predicate: (q) => q.queryKey[0] !== authKeys.all[0] });
      return api<void>('/auth/logout', { method: 'POST' });
    },
    onSuccess: () => {
      qc.setQueryData(authKeys.me(), null);
      setTimeout(() => qc.removeQueries({ predicate: (q) => q.queryKey[0] !== authKeys.all[0] }), 0);
    },
  });
};

export const useChangePassword = () =>
  useMutation({
    mutationFn: (body: { currentPassword: string; newPassword: string }) => api<void>('/me/password', { body }),
  });
