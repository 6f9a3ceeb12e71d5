import { queryOptions, useQuery } from '@tanstack/react-query';
import { signUpPreviewResponse } from '#shared/schemas/auth';
import { apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

/** Which address a sign-up link is for (and whether it still works). */
export const previewSignUp = (token: string) =>
  apiRequest(`/auth/sign-up/preview?token=${encodeURIComponent(token)}`, {
    schema: signUpPreviewResponse,
  });

export const signUpPreviewQueryOptions = (token: string) =>
  queryOptions({
    queryKey: queryKeys.auth.signUpLink(token),
    queryFn: () => previewSignUp(token),
    retry: false,
  });

export const useSignUpPreview = (token: string) => useQuery(signUpPreviewQueryOptions(token));
