import { useMutation } from '@tanstack/react-query';
import { noContent } from '#shared/schemas/common';
import { apiRequest } from '@/lib/api-client';

export const resetPassword = (body: { token: string; password: string }) =>
  apiRequest('/auth/reset', { method: 'POST', body, schema: noContent });
export const useResetPassword = () => useMutation({ mutationFn: resetPassword });
