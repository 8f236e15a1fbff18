// Models' boards and their parts lists: fetchers, query-option factories (the only place their keys live) and hooks.
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type {
  BoardPartsList,
  ModelBoard,
  ModelBoardInput,
  ModelBoardUpdate,
  PartsListSave,
  PartsListsOverview,
} from '@bumperline/contracts/parts-lists';
import { api, get, patch, post } from '../lib/api-client.ts';

export const partsListKeys = {
  all: ['parts-lists'] as const,
  overview: ['parts-lists', 'overview'] as const,
  board: (id: string) => ['parts-lists', 'board', id] as const,
};

export const partsListsOverviewQuery = () =>
  queryOptions({ queryKey: partsListKeys.overview, queryFn: () => get<PartsListsOverview>('/api/parts-lists') });
export const boardPartsListQuery = (id: string) =>
  queryOptions({
    queryKey: partsListKeys.board(id),
    queryFn: () => get<BoardPartsList>(`/api/boards/${id}`),
    // The editor holds its own rows once opened (a refetch behind it would change nothing it shows); it opens on
    // the list as fetched when the screen mounts, and a later save by someone else comes back as a 409.
    refetchOnWindowFocus: false,
  });

export const usePartsListsOverview = () => useQuery(partsListsOverviewQuery());
export const useBoardPartsList = (id: string) => useQuery(boardPartsListQuery(id));

export function useCreateBoard(modelId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: ModelBoardInput) => post<ModelBoard>(`/api/models/${modelId}/boards`, body),
    onSuccess: () => qc.invalidateQueries({ queryKey: partsListKeys.overview }),
  });
}

export function useUpdateBoard(boardId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: ModelBoardUpdate) => patch<ModelBoard>(`/api/boards/${boardId}`, body),
    onSuccess: (board) => {
      qc.setQueryData(partsListKeys.board(boardId), (old: BoardPartsList | undefined) => (old ? { ...old, board } : old));
      return qc.invalidateQueries({ queryKey: partsListKeys.overview });
    },
  });
}

/** Saves the whole list at the version it was opened at; a 409 means someone else saved since. */
export function useSavePartsList(boardId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: PartsListSave) => api<BoardPartsList>('PUT', `/api/boards/${boardId}/parts`, { body }),
    onSuccess: (saved) => {
      qc.setQueryData(partsListKeys.board(boardId), saved);
      return qc.invalidateQueries({ queryKey: partsListKeys.overview });
    },
  });
}

/** The list as someone else saved it, fetched afresh (after a 409). */
export function useReloadPartsList(boardId: string) {
  const qc = useQueryClient();
  return () => qc.fetchQuery({ ...boardPartsListQuery(boardId), staleTime: 0 });
}
