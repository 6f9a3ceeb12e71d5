import { useMutation } from '@tanstack/react-query';
import { signUpStartedResponse, type SignUpBody } from '#shared/schemas/auth';
import { apiRequest } from '@/lib/api-client';

/** The first step: the server e-mails a link (or, for a known address, a note to its owner). */
export const startSignUp = (body: SignUpBody) =>
  apiRequest('/auth/sign-up', { method: 'POST', body, schema: signUpStartedResponse });

export const useStartSignUp = () => useMutation({ mutationFn: startSignUp });
