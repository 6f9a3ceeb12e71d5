import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { ClimateToday, LoggerImportBody, RoomTargetsInput } from '#shared/schemas/climate';
import { ApiError, apiRequest } from '@/lib/api-client';
import { withDb } from '@/lib/db';
import { queryKeys } from '@/lib/query-keys';

const schemas = () => import('#shared/schemas/climate');
const base = (collectionId: string) => `/collections/${collectionId}/climate`;

/**
 * Today's rooms (their typed reading due or done) and the rooms out of range in the last day,
 * kept on the phone as last fetched (in `meta`, forgotten at sign-out) so the reading card
 * opens with no signal.
 */
export const useClimateToday = (collectionId: string) =>
  useQuery({
    queryKey: queryKeys.climate.today(collectionId),
    networkMode: 'always',
    queryFn: async () => {
      const key = `climate-today:${collectionId}`;
      try {
        const answer = await apiRequest(`${base(collectionId)}/today`, {
          schema: async () => (await schemas()).climateTodayResponse,
        });
        await withDb((db) => db.put('meta', answer, key));
        return answer;
      } catch (err) {
        // Only with no answer at all: a refusal (403, 404) must not show a stale copy.
        if (!(err instanceof ApiError && err.status === 0)) throw err;
        const held = await withDb((db) => db.get('meta', key));
        if (held) return held as ClimateToday;
        throw err;
      }
    },
    refetchInterval: 5 * 60_000,
  });

/** Every room of the places with its targets and newest reading (keepers). */
export const useClimateRooms = (collectionId: string) =>
  useQuery({
    queryKey: queryKeys.climate.rooms(collectionId),
    queryFn: () =>
      apiRequest(`${base(collectionId)}/rooms`, {
        schema: async () => (await schemas()).climateRoomsResponse,
      }),
  });

export function useSetTargets(collectionId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: RoomTargetsInput) =>
      apiRequest(`${base(collectionId)}/targets`, {
        method: 'PUT',
        body,
        schema: async () => (await schemas()).roomTargetsResponse,
      }),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: queryKeys.climate.all(collectionId) }),
  });
}

/** A room's days (the chart) and newest readings (keepers). */
export const useRoomHistory = (collectionId: string, room: string, days: number) =>
  useQuery({
    queryKey: queryKeys.climate.history(collectionId, room, days),
    queryFn: () =>
      apiRequest(`${base(collectionId)}/history?room=${encodeURIComponent(room)}&days=${days}`, {
        schema: async () => (await schemas()).roomHistoryResponse,
      }),
    enabled: !!room,
  });

export function useImportLogger(collectionId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: LoggerImportBody) =>
      apiRequest(`${base(collectionId)}/import`, {
        method: 'POST',
        body,
        schema: async () => (await schemas()).loggerImportResponse,
      }),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: queryKeys.climate.all(collectionId) }),
  });
}

/** The animal's room, day by day (its timeline). */
export const useAnimalClimate = (collectionId: string, animalId: string) =>
  useQuery({
    queryKey: queryKeys.climate.animal(collectionId, animalId),
    queryFn: () =>
      apiRequest(`${base(collectionId)}/animals/${animalId}`, {
        schema: async () => (await schemas()).animalClimateResponse,
      }),
  });
