import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { LoggerImportBody, RoomTargetsInput } from '#shared/schemas/climate';
import { apiRequest } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

const schemas = () => import('#shared/schemas/climate');
const base = (collectionId: string) => `/collections/${collectionId}/climate`;

/** Today's rooms (their typed reading due or done) and the rooms out of range in the last day. */
export const useClimateToday = (collectionId: string) =>
  useQuery({
    queryKey: queryKeys.climate.today(collectionId),
    queryFn: () =>
      apiRequest(`${base(collectionId)}/today`, {
        schema: async () => (await schemas()).climateTodayResponse,
      }),
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
