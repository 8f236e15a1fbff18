// A game's meters, readings and keep cost: fetchers, query-option factories (the only place their keys live), hooks.
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { GameKeepCost, GameMeterList, LatestMeterReadings, MeterReading, MeterReadingInput } from '@bumperline/contracts/meters';
import { get, post, put } from '../lib/api-client.ts';

export const meterKeys = {
  meters: (gameId: string) => ['games', 'meters', gameId] as const,
  latest: (gameId: string) => ['games', 'meter-readings', gameId] as const,
  keepCost: (gameId: string) => ['games', 'keep-cost', gameId] as const,
};

export const gameMetersQuery = (gameId: string) =>
  queryOptions({ queryKey: meterKeys.meters(gameId), queryFn: () => get<GameMeterList>(`/api/games/${gameId}/meters`) });
export const latestReadingsQuery = (gameId: string) =>
  queryOptions({
    queryKey: meterKeys.latest(gameId),
    queryFn: () => get<LatestMeterReadings>(`/api/games/${gameId}/meter-readings/latest`),
  });
export const keepCostQuery = (gameId: string) =>
  queryOptions({ queryKey: meterKeys.keepCost(gameId), queryFn: () => get<GameKeepCost>(`/api/games/${gameId}/keep-cost`) });

export const useGameMeters = (gameId: string) => useQuery(gameMetersQuery(gameId));
export const useLatestReadings = (gameId: string) => useQuery(latestReadingsQuery(gameId));
export const useKeepCost = (gameId: string) => useQuery(keepCostQuery(gameId));

export function useRecordReading(gameId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: MeterReadingInput) => post<MeterReading>(`/api/games/${gameId}/meter-readings`, body),
    onSuccess: () => qc.invalidateQueries({ queryKey: meterKeys.latest(gameId) }),
  });
}

export function useSaveGameMeters(gameId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: GameMeterList) => put<GameMeterList>(`/api/games/${gameId}/meters`, body),
    onSuccess: (saved) => qc.setQueryData(meterKeys.meters(gameId), saved),
  });
}
