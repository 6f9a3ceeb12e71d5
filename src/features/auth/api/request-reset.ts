import { useMutation } from '@tanstack/react-query';
import { resetRequestedResponse } from '#shared/schemas/auth';
import { apiRequest } from '@/lib/api-client';

export const requestReset = (email: string) =>
  apiRequest('/auth/reset-request', {
    method: 'POST',
    body: { email },
    schema: resetRequestedResponse,
  });
export const useRequestReset = () => useMutation({ mutationFn: requestReset });
