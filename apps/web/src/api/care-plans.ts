// Care-plan endpoints: fetchers, query-option factories (the only place their keys live) and hooks.
import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type {
  CarePlan,
  CarePlanDetail,
  CarePlanInput,
  CarePlanListQuery,
  CarePlanPage,
  CarePlanUpdate,
} from '@bumperline/contracts/care-plans';
import { get, post, put } from '../lib/api-client.ts';

export const carePlanKeys = {
  all: ['care-plans'] as const,
  list: (q: CarePlanListQuery) => ['care-plans', 'list', q] as const,
  detail: (id: string) => ['care-plans', 'detail', id] as const,
};

export const listCarePlans = (q: CarePlanListQuery) => get<CarePlanPage>('/api/care-plans', q as Record<string, string>);

export const carePlanListQuery = (q: CarePlanListQuery) =>
  queryOptions({ queryKey: carePlanKeys.list(q), queryFn: () => listCarePlans(q), placeholderData: keepPreviousData });
export const carePlanQuery = (id: string) =>
  queryOptions({ queryKey: carePlanKeys.detail(id), queryFn: () => get<CarePlanDetail>(`/api/care-plans/${id}`) });

export const useCarePlans = (q: CarePlanListQuery) => useQuery(carePlanListQuery(q));
export const useCarePlan = (id: string, enabled = true) => useQuery({ ...carePlanQuery(id), enabled });

/** Creates a plan, or replaces one whole at the version it was loaded at. */
export function useSaveCarePlan(id?: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CarePlanInput | CarePlanUpdate) =>
      id ? put<CarePlan>(`/api/care-plans/${id}`, body) : post<CarePlan>('/api/care-plans', body),
    onSuccess: () => qc.invalidateQueries({ queryKey: carePlanKeys.all }),
  });
}

export function useRetireCarePlan(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (version: number) => post<CarePlan>(`/api/care-plans/${id}/retire`, { version }),
    onSuccess: () => qc.invalidateQueries({ queryKey: carePlanKeys.all }),
  });
}
