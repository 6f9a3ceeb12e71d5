import { useMutation } from '@tanstack/react-query';
import { noContent } from '#shared/schemas/common';
import { apiRequest } from '@/lib/api-client';

export const changePassword = (body: { currentPassword: string; newPassword: string }) =>
  apiRequest('/auth/password', { method: 'POST', body, schema: noContent });
export const useChangePassword = () => useMutation({ mutationFn: changePassword });
