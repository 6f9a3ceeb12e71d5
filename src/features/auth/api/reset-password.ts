import { useMutation } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';

export const resetPassword = (body: { token: string; password: string }) => apiRequest('/auth/reset', { method: 'POST', body });
export const useResetPassword = () => useMutation({ mutationFn: resetPassword });
