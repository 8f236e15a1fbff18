// Parts used on a service call or a work order: the job's list and recording one (off the person's van, or a stock
// the office names). Recording changes the van too, so it invalidates the stock and the catalogue's quantities.
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { PartUsed, PartsUsedInput, PartsUsedList } from '@bumperline/contracts/parts-used';
import { get, post } from '../lib/api-client.ts';
import { partKeys } from './parts-catalogue.ts';
import { stockKeys } from './stock.ts';

export type PartsUsedJob = { kind: 'call'; id: string } | { kind: 'workOrder'; id: string };

/** The job's API path: /api/calls/:id or /api/work-orders/:id, then /parts-used. */
export const partsUsedPath = (job: PartsUsedJob) => `/api/${job.kind === 'call' ? 'calls' : 'work-orders'}/${job.id}/parts-used`;

export const partsUsedKeys = {
  all: ['parts-used'] as const,
  job: (job: PartsUsedJob) => ['parts-used', job.kind, job.id] as const,
};

export const partsUsedQuery = (job: PartsUsedJob) =>
  queryOptions({ queryKey: partsUsedKeys.job(job), queryFn: () => get<PartsUsedList>(partsUsedPath(job)) });
export const usePartsUsed = (job: PartsUsedJob) => useQuery(partsUsedQuery(job));

export const recordPartUsed = (job: PartsUsedJob, body: PartsUsedInput) => post<PartUsed>(partsUsedPath(job), body);

export function useRecordPartUsed(job: PartsUsedJob) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: PartsUsedInput) => recordPartUsed(job, body),
    onSuccess: () =>
      Promise.all([
        qc.invalidateQueries({ queryKey: partsUsedKeys.job(job) }),
        qc.invalidateQueries({ queryKey: stockKeys.all }),
        qc.invalidateQueries({ queryKey: partKeys.all }),
      ]),
  });
}
