// Work-order endpoints: fetchers, query-option factories (the only place their keys live) and hooks.
import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type {
  WorkOrder,
  WorkOrderDone,
  WorkOrderListQuery,
  WorkOrderMove,
  WorkOrderOpenBenchJob,
  WorkOrderPage,
  WorkOrderSkip,
} from '@bumperline/contracts/work-orders';
import { ApiError, get, post } from '../lib/api-client.ts';

export const workOrderKeys = {
  all: ['work-orders'] as const,
  list: (q: WorkOrderListQuery) => ['work-orders', 'list', q] as const,
  detail: (id: string) => ['work-orders', 'detail', id] as const,
};

export const listWorkOrders = (q: WorkOrderListQuery) => get<WorkOrderPage>('/api/work-orders', q as Record<string, string>);

export const workOrderListQuery = (q: WorkOrderListQuery) =>
  queryOptions({ queryKey: workOrderKeys.list(q), queryFn: () => listWorkOrders(q), placeholderData: keepPreviousData });
export const workOrderQuery = (id: string) =>
  queryOptions({ queryKey: workOrderKeys.detail(id), queryFn: () => get<WorkOrder>(`/api/work-orders/${id}`) });

export const useWorkOrders = (q: WorkOrderListQuery) => useQuery(workOrderListQuery(q));
export const useWorkOrder = (id: string) => useQuery(workOrderQuery(id));

type Action =
  | { kind: 'move'; body: WorkOrderMove }
  | { kind: 'skip'; body: WorkOrderSkip }
  | { kind: 'done'; body: WorkOrderDone }
  | { kind: 'bench-job'; body: WorkOrderOpenBenchJob };

/** Move, skip, done or open the bench job, at the version shown; the order's page and every list follow. */
export function useWorkOrderAction(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (a: Action) => post<WorkOrder>(`/api/work-orders/${id}/${a.kind}`, a.body),
    onSuccess: (order) => {
      qc.setQueryData(workOrderKeys.detail(order.id), order);
      return qc.invalidateQueries({ queryKey: ['work-orders', 'list'] });
    },
    // Changed or closed elsewhere (409): show it as it now stands.
    onError: (err) => {
      if (err instanceof ApiError && err.status === 409) return qc.invalidateQueries({ queryKey: workOrderKeys.detail(id) });
    },
  });
}
