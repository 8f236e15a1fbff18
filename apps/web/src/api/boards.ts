// Boards fitted in games, a board's page (its parts with every reading), a game's cabinet profile and the recap
// list: fetchers, query-option factories (the only place their keys live) and hooks.
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type {
  BoardInstance,
  BoardInstanceInput,
  BoardInstanceUpdate,
  BoardPage,
  CabinetProfile,
  CabinetProfileInput,
  GameBoards,
  RecapFleet,
  RecapStatus,
} from '@bumperline/contracts/boards';
import { api, get, patch, post } from '../lib/api-client.ts';

export const boardKeys = {
  all: ['boards'] as const,
  ofGame: (gameId: string) => ['boards', 'game', gameId] as const,
  page: (id: string) => ['boards', 'page', id] as const,
  cabinet: (gameId: string) => ['boards', 'cabinet', gameId] as const,
  recapDue: (status: RecapStatus | undefined, cursor: string | undefined) =>
    ['boards', 'recap-due', status ?? 'all', cursor ?? 'first'] as const,
};

export const gameBoardsQuery = (gameId: string) =>
  queryOptions({ queryKey: boardKeys.ofGame(gameId), queryFn: () => get<GameBoards>(`/api/games/${gameId}/boards`) });
export const boardPageQuery = (id: string) =>
  queryOptions({ queryKey: boardKeys.page(id), queryFn: () => get<BoardPage>(`/api/board-instances/${id}`) });
export const cabinetProfileQuery = (gameId: string) =>
  queryOptions({ queryKey: boardKeys.cabinet(gameId), queryFn: () => get<CabinetProfile>(`/api/games/${gameId}/cabinet-profile`) });
/** One page of the recap ranking (the server's page size), after `cursor`. */
export const recapDueQuery = (status: RecapStatus | undefined, cursor: string | undefined) =>
  queryOptions({
    queryKey: boardKeys.recapDue(status, cursor),
    queryFn: () => get<RecapFleet>('/api/recap-due', { status, cursor }),
  });

export const useGameBoards = (gameId: string) => useQuery(gameBoardsQuery(gameId));
export const useBoardPage = (id: string) => useQuery(boardPageQuery(id));
export const useCabinetProfile = (gameId: string) => useQuery(cabinetProfileQuery(gameId));
export const useRecapDue = (status: RecapStatus | undefined, cursor: string | undefined) => useQuery(recapDueQuery(status, cursor));

/** Recap dates depend on boards and profiles alike: any change refreshes every board view. */
const refreshBoards = (qc: ReturnType<typeof useQueryClient>) => qc.invalidateQueries({ queryKey: boardKeys.all });

export function useFitBoard(gameId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: BoardInstanceInput) => post<BoardInstance>(`/api/games/${gameId}/boards`, body),
    onSuccess: () => refreshBoards(qc),
  });
}

export function useEditBoard(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: BoardInstanceUpdate) => patch<BoardInstance>(`/api/board-instances/${id}`, body),
    onSuccess: () => refreshBoards(qc),
  });
}

export function useSaveCabinetProfile(gameId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CabinetProfileInput) => api<CabinetProfile>('PUT', `/api/games/${gameId}/cabinet-profile`, { body }),
    onSuccess: (profile) => {
      qc.setQueryData(boardKeys.cabinet(gameId), profile);
      return refreshBoards(qc);
    },
  });
}
