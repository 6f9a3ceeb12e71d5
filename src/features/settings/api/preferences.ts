import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { TemperatureUnit } from '#shared/domain/temperature';
import { rememberMe } from '@/features/auth/api/get-me';
import { apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

/** The person's own temperature unit, kept on the server: every device and e-mail follows it. */
export function useSaveTemperatureUnit() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (temperatureUnit: TemperatureUnit) =>
      apiRequest('/auth/me', {
        method: 'PATCH',
        body: { temperatureUnit },
        schema: async () => (await import('#shared/schemas/auth')).meResponse,
      }),
    onSuccess: (me) => {
      queryClient.setQueryData(queryKeys.auth.me(), me);
      void rememberMe(me);
    },
  });
}
