import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

export const requestReset = (email: string) =>
  apiRequest('/auth/reset-request', { method: 'POST', body: { email }, schema: z.object({ message: z.string() }) });
export const useRequestReset = () => useMutation({ mutationFn: requestReset });
