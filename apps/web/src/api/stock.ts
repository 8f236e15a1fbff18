// Stock endpoints: stocks, levels, receive/transfer/count, movements, the signed-in person's van, what to order.
// Query keys live only here; every change invalidates the stock and the catalogue (its quantities move too).
import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type {
  MyVan,
  ReorderList,
  StockChange,
  StockCountInput,
  StockLevel,
  StockLevelListQuery,
  StockLevelPage,
  StockLevelSettings,
  StockLocation,
  StockLocationInput,
  StockLocationList,
  StockMovementListQuery,
  StockMovementPage,
  StockReceiveInput,
  StockTransferInput,
} from '@bumperline/contracts/stock';
import { get, patch, post, put } from '../lib/api-client.ts';
import { partKeys } from './parts-catalogue.ts';

export const stockKeys = {
  all: ['stock'] as const,
  locations: ['stock', 'locations'] as const,
  location: (id: string) => ['stock', 'location', id] as const,
  levels: (id: string, q: StockLevelListQuery) => ['stock', 'levels', id, q] as const,
  movements: (q: StockMovementListQuery) => ['stock', 'movements', q] as const,
  myVan: ['stock', 'my-van'] as const,
  reorder: ['stock', 'reorder'] as const,
};

export const stockLocationsQuery = () =>
  queryOptions({ queryKey: stockKeys.locations, queryFn: () => get<StockLocationList>('/api/stock/locations') });
export const stockLocationQuery = (id: string) =>
  queryOptions({ queryKey: stockKeys.location(id), queryFn: () => get<StockLocation>(`/api/stock/locations/${id}`) });
export const listStockLevels = (id: string, q: StockLevelListQuery) =>
  get<StockLevelPage>(`/api/stock/locations/${id}/levels`, q as Record<string, string>);
export const stockLevelsQuery = (id: string, q: StockLevelListQuery) =>
  queryOptions({ queryKey: stockKeys.levels(id, q), queryFn: () => listStockLevels(id, q), placeholderData: keepPreviousData });
export const stockMovementsQuery = (q: StockMovementListQuery) =>
  queryOptions({
    queryKey: stockKeys.movements(q),
    queryFn: () => get<StockMovementPage>('/api/stock/movements', q as Record<string, string>),
    placeholderData: keepPreviousData,
  });
export const myVanQuery = () => queryOptions({ queryKey: stockKeys.myVan, queryFn: () => get<MyVan>('/api/stock/my-van') });
export const reorderQuery = () => queryOptions({ queryKey: stockKeys.reorder, queryFn: () => get<ReorderList>('/api/stock/reorder') });

export const useStockLocations = () => useQuery(stockLocationsQuery());
export const useStockLocation = (id: string) => useQuery(stockLocationQuery(id));
export const useStockLevels = (id: string, q: StockLevelListQuery) => useQuery(stockLevelsQuery(id, q));
export const useStockMovements = (q: StockMovementListQuery) => useQuery(stockMovementsQuery(q));
export const useMyVan = () => useQuery(myVanQuery());
export const useReorderList = () => useQuery(reorderQuery());

/** Every level of a stock matching a search, page by page (for export). */
export async function allStockLevels(id: string, q: Omit<StockLevelListQuery, 'cursor' | 'limit'>): Promise<StockLevel[]> {
  const out: StockLevel[] = [];
  let cursor: string | undefined;
  do {
    const page = await listStockLevels(id, { ...q, limit: 200, cursor });
    out.push(...page.items);
    cursor = page.nextCursor ?? undefined;
  } while (cursor && out.length < 10_000);
  return out;
}

function useStockChange<V, R>(send: (v: V) => Promise<R>) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: send,
    onSuccess: () => Promise.all([qc.invalidateQueries({ queryKey: stockKeys.all }), qc.invalidateQueries({ queryKey: partKeys.all })]),
  });
}

export const useReceiveStock = () => useStockChange((v: StockReceiveInput) => post<StockChange>('/api/stock/receive', v));
export const useTransferStock = () => useStockChange((v: StockTransferInput) => post<StockChange>('/api/stock/transfer', v));
export const useCountStock = () => useStockChange((v: StockCountInput) => post<StockChange>('/api/stock/count', v));
export const useAddStockLocation = () => useStockChange((v: StockLocationInput) => post<StockLocation>('/api/stock/locations', v));
export const useRenameStockLocation = (id: string) =>
  useStockChange((name: string) => patch<StockLocation>(`/api/stock/locations/${id}`, { name }));
export const useRetireStockLocation = (id: string) => useStockChange(() => post<StockLocation>(`/api/stock/locations/${id}/retire`));
export const useSetReorder = (locationId: string) =>
  useStockChange((v: StockLevelSettings & { partId: string }) => {
    const { partId, ...body } = v;
    return put<StockLevel>(`/api/stock/locations/${locationId}/levels/${partId}`, body);
  });
/** Makes the signed-in person's van when they have none. */
export const useMakeMyVan = () => useStockChange(() => post<MyVan>('/api/stock/my-van'));
