// Service-call endpoints: fetchers, query-option factories (the only place their keys live) and hooks.
import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type {
  CallDetail,
  CallListQuery,
  CallPage,
  CallState,
  NoteAdded,
  OpenCallInput,
  OpenedCall,
  RankedTechnicianList,
  ServiceCall,
  Severity,
  TechnicianList,
} from '@bumperline/contracts/calls';
import { get, post } from '../lib/api-client.ts';

export const callKeys = {
  all: ['calls'] as const,
  list: (q: CallListQuery) => ['calls', 'list', q] as const,
  detail: (id: string) => ['calls', 'detail', id] as const,
  technicians: (id: string) => ['calls', 'technicians', id] as const,
  allTechnicians: ['technicians'] as const,
};

export const listCalls = (q: CallListQuery) => get<CallPage>('/api/calls', q as Record<string, string>);
export const callListQuery = (q: CallListQuery) =>
  queryOptions({ queryKey: callKeys.list(q), queryFn: () => listCalls(q), placeholderData: keepPreviousData, refetchInterval: 30_000 });
export const callQuery = (id: string) =>
  queryOptions({ queryKey: callKeys.detail(id), queryFn: () => get<CallDetail>(`/api/calls/${id}`) });
export const rankedTechniciansQuery = (id: string) =>
  queryOptions({ queryKey: callKeys.technicians(id), queryFn: () => get<RankedTechnicianList>(`/api/calls/${id}/technicians`) });

export const useCalls = (q: CallListQuery, enabled = true) => useQuery({ ...callListQuery(q), enabled });
export const useCall = (id: string) => useQuery(callQuery(id));
export const useRankedTechnicians = (id: string, enabled: boolean) => useQuery({ ...rankedTechniciansQuery(id), enabled });
/** The company's technicians (for dispatchers: the technician filter). */
export const techniciansQuery = () =>
  queryOptions({ queryKey: callKeys.allTechnicians, queryFn: () => get<TechnicianList>('/api/technicians') });
export const useTechnicians = (enabled: boolean) => useQuery({ ...techniciansQuery(), enabled });

export async function allCalls(q: Omit<CallListQuery, 'cursor' | 'limit'>): Promise<ServiceCall[]> {
  const out: ServiceCall[] = [];
  let cursor: string | undefined;
  do {
    const page = await listCalls({ ...q, limit: 200, cursor });
    out.push(...page.items);
    cursor = page.nextCursor ?? undefined;
  } while (cursor && out.length < 10_000);
  return out;
}

/** Every change to a call can change the call lists, the game's status and the venue view. */
function useCallMutation<V, R>(fn: (v: V) => Promise<R>) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSettled: () =>
      Promise.all([
        qc.invalidateQueries({ queryKey: callKeys.all }),
        qc.invalidateQueries({ queryKey: ['games'] }),
        qc.invalidateQueries({ queryKey: ['venue-view'] }),
      ]),
  });
}

export const useOpenCall = () => useCallMutation((v: OpenCallInput) => post<OpenedCall>('/api/calls', v));
export const useAssignCall = (id: string) =>
  useCallMutation((v: { technicianId: string | null; version: number }) => post<ServiceCall>(`/api/calls/${id}/assign`, v));
export const useTransitionCall = (id: string) =>
  useCallMutation((v: { to: CallState; version: number; note?: string }) => post<ServiceCall>(`/api/calls/${id}/transition`, v));
export const useAnswerAssignment = (id: string) =>
  useCallMutation((accept: boolean) => post<ServiceCall>(`/api/calls/${id}/answer`, { accept }));
export const useAddNote = (id: string) => useCallMutation((note: string) => post<NoteAdded>(`/api/calls/${id}/notes`, { note }));
export const useSetSeverity = (id: string) =>
  useCallMutation((v: { severity: Severity; version: number }) => post<ServiceCall>(`/api/calls/${id}/severity`, v));
