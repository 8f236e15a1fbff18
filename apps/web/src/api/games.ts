// Game and game-model endpoints: fetchers, query-option factories (the only place their keys live) and hooks.
import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type {
  DowntimeList,
  Game,
  GameDetail,
  GameInput,
  GameListQuery,
  GameModel,
  GameModelInput,
  GameModelList,
  GamePage,
  GameSummary,
  GameUpdate,
  TagRegenerated,
} from '@bumperline/contracts/games';
import { get, patch, post } from '../lib/api-client.ts';

export const gameKeys = {
  all: ['games'] as const,
  list: (q: GameListQuery) => ['games', 'list', q] as const,
  detail: (id: string) => ['games', 'detail', id] as const,
  models: ['models'] as const,
};

export const listGames = (q: GameListQuery) => get<GamePage>('/api/games', q as Record<string, string>);

export const gameListQuery = (q: GameListQuery) =>
  queryOptions({ queryKey: gameKeys.list(q), queryFn: () => listGames(q), placeholderData: keepPreviousData });
export const gameQuery = (id: string) =>
  queryOptions({ queryKey: gameKeys.detail(id), queryFn: () => get<GameDetail>(`/api/games/${id}`) });
export const modelsQuery = () =>
  queryOptions({ queryKey: gameKeys.models, queryFn: () => get<GameModelList>('/api/models'), staleTime: 5 * 60_000 });

export const useGames = (q: GameListQuery) => useQuery(gameListQuery(q));
export const useGame = (id: string) => useQuery(gameQuery(id));
export const useModels = () => useQuery(modelsQuery());

export async function allGames(q: Omit<GameListQuery, 'cursor' | 'limit'>): Promise<Game[]> {
  const out: Game[] = [];
  let cursor: string | undefined;
  do {
    const page = await listGames({ ...q, limit: 200, cursor });
    out.push(...page.items);
    cursor = page.nextCursor ?? undefined;
  } while (cursor && out.length < 10_000);
  return out;
}

export function useSaveGame(id?: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: GameInput | GameUpdate) => (id ? patch<Game>(`/api/games/${id}`, body) : post<Game>('/api/games', body)),
    onSuccess: (game) => {
      qc.setQueryData(gameKeys.detail(game.id), game);
      // A venue's game count changes too.
      return Promise.all([qc.invalidateQueries({ queryKey: gameKeys.all }), qc.invalidateQueries({ queryKey: ['venues'] })]);
    },
  });
}

export function useRetireGame(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => post<Game>(`/api/games/${id}/retire`),
    onSuccess: () => Promise.all([qc.invalidateQueries({ queryKey: gameKeys.all }), qc.invalidateQueries({ queryKey: ['venues'] })]),
  });
}

export function useCreateModel() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: GameModelInput) => post<GameModel>('/api/models', body),
    onSuccess: () => qc.invalidateQueries({ queryKey: gameKeys.models }),
  });
}

export const gameSummaryQuery = () =>
  queryOptions({
    queryKey: ['games', 'summary'] as const,
    queryFn: () => get<GameSummary>('/api/games/summary'),
  });
export const useGameSummary = () => useQuery(gameSummaryQuery());

export const gameDowntimeQuery = (id: string) =>
  queryOptions({
    queryKey: ['games', 'downtime', id] as const,
    queryFn: () => get<DowntimeList>(`/api/games/${id}/downtime`),
  });
export const useGameDowntime = (id: string) => useQuery(gameDowntimeQuery(id));

/** A new game tag: the printed QR code stops working at once. */
export function useRegenerateTag(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => post<TagRegenerated>(`/api/games/${id}/regenerate-tag`),
    onSuccess: () => qc.invalidateQueries({ queryKey: gameKeys.detail(id) }),
  });
}
