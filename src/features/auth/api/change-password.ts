import { useMutation } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';

export const changePassword = (body: { currentPassword: string; newPassword: string }) =>
  apiRequest('/auth/password', { method: 'POST', body });
export const useChangePassword = () => useMutation({ mutationFn: changePassword });
