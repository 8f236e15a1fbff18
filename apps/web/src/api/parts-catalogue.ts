// Parts catalogue endpoints: fetchers, query-option factories (the only place catalogue query keys live) and hooks.
import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type {
  BoardCatalogueFitList,
  CatalogueListQuery,
  CataloguePage,
  CataloguePart,
  CataloguePartDetail,
  CataloguePartInput,
  CataloguePartUpdate,
  PartFitList,
} from '@bumperline/contracts/parts-catalogue';
import { del, get, patch, post } from '../lib/api-client.ts';

export const partKeys = {
  all: ['parts'] as const,
  list: (q: CatalogueListQuery) => ['parts', 'list', q] as const,
  detail: (id: string) => ['parts', 'detail', id] as const,
  boardFits: (boardId: string) => ['parts', 'board-fits', boardId] as const,
};

export const listParts = (q: CatalogueListQuery) => get<CataloguePage>('/api/parts', q as Record<string, string>);

export const partListQuery = (q: CatalogueListQuery) =>
  queryOptions({ queryKey: partKeys.list(q), queryFn: () => listParts(q), placeholderData: keepPreviousData });
export const partQuery = (id: string) =>
  queryOptions({ queryKey: partKeys.detail(id), queryFn: () => get<CataloguePartDetail>(`/api/parts/${id}`) });
/** The catalogue parts that fit a model board's parts-list entries, with the signed-in person's van quantity. */
export const boardCatalogueFitsQuery = (boardId: string) =>
  queryOptions({
    queryKey: partKeys.boardFits(boardId),
    queryFn: () => get<BoardCatalogueFitList>(`/api/boards/${boardId}/catalogue-fits`),
  });

export const useParts = (q: CatalogueListQuery, enabled = true) => useQuery({ ...partListQuery(q), enabled });
export const usePart = (id: string) => useQuery(partQuery(id));
export const useBoardCatalogueFits = (boardId: string | undefined) =>
  useQuery({ ...boardCatalogueFitsQuery(boardId ?? ''), enabled: !!boardId });

/** Every part matching a search, page by page (for export). */
export async function allParts(q: Omit<CatalogueListQuery, 'cursor' | 'limit'>): Promise<CataloguePart[]> {
  const out: CataloguePart[] = [];
  let cursor: string | undefined;
  do {
    const page = await listParts({ ...q, limit: 200, cursor });
    out.push(...page.items);
    cursor = page.nextCursor ?? undefined;
  } while (cursor && out.length < 10_000);
  return out;
}

export function useSavePart(id?: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CataloguePartInput | CataloguePartUpdate) =>
      id ? patch<CataloguePart>(`/api/parts/${id}`, body) : post<CataloguePart>('/api/parts', body),
    onSuccess: () => qc.invalidateQueries({ queryKey: partKeys.all }),
  });
}

export function useRetirePart(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => post<CataloguePart>(`/api/parts/${id}/retire`),
    onSuccess: () => qc.invalidateQueries({ queryKey: partKeys.all }),
  });
}

export function useLinkFit(partId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: { boardPartId: string; link: boolean }) =>
      v.link
        ? post<PartFitList>(`/api/parts/${partId}/fits`, { boardPartId: v.boardPartId })
        : del<PartFitList>(`/api/parts/${partId}/fits/${v.boardPartId}`),
    onSuccess: () => qc.invalidateQueries({ queryKey: partKeys.all }),
  });
}
