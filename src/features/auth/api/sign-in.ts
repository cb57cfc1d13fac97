import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Me, SignInBody } from '@shared/schemas/users';
import { api } from '@/lib/api-client';
import { authKeys } from './me';

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

export const useSignOut = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api<void>('/auth/logout', { method: 'POST' }),
    onSuccess: () => {
      qc.clear();
      qc.setQueryData(authKeys.me(), null);
    },
  });
};

export const useChangePassword = () =>
  useMutation({
    mutationFn: (body: { currentPassword: string; newPassword: string }) => api<void>('/me/password', { body }),
  });
