// Bench-job endpoints: fetchers, query-option factories (the only place their keys live) and hooks. Draft saves
// are not a mutation hook: the job screen's autosave sends them (saveBenchDraft) and keeps the cache in step.
import { queryOptions, useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import type {
  BenchDraftSaved,
  BenchJob,
  BenchJobDraft,
  BenchJobListQuery,
  BenchJobOpen,
  BenchJobPage,
  BenchPhotoUploaded,
} from '@bumperline/contracts/bench-jobs';
import { get, post, postForm, put } from '../lib/api-client.ts';

export const benchJobKeys = {
  all: ['bench-jobs'] as const,
  list: (q: BenchJobListQuery) => ['bench-jobs', 'list', q] as const,
  detail: (id: string) => ['bench-jobs', 'detail', id] as const,
};

export const benchJobListQuery = (q: BenchJobListQuery) =>
  queryOptions({
    queryKey: benchJobKeys.list(q),
    queryFn: () => get<BenchJobPage>('/api/bench-jobs', q as Record<string, string | number>),
  });
export const benchJobQuery = (id: string) =>
  queryOptions({
    queryKey: benchJobKeys.detail(id),
    queryFn: () => get<BenchJob>(`/api/bench-jobs/${id}`),
    // The open job screen owns its draft: a refetch on focus must not replace what is being typed.
    refetchOnWindowFocus: false,
    staleTime: Infinity,
  });

export const useBenchJobs = (q: BenchJobListQuery) => useQuery(benchJobListQuery(q));
/** Always loaded fresh when the screen opens: resuming on another device starts from the server's draft. */
export const useBenchJob = (id: string) => useQuery({ ...benchJobQuery(id), refetchOnMount: 'always' });

export function useOpenBenchJob() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: BenchJobOpen) => post<BenchJob>('/api/bench-jobs', body),
    onSuccess: (job) => {
      qc.setQueryData(benchJobKeys.detail(job.id), job);
      return invalidateBenchLists(qc);
    },
  });
}

export const saveBenchDraft = (id: string, version: number, draft: BenchJobDraft) =>
  put<BenchDraftSaved>(`/api/bench-jobs/${id}/draft`, { version, draft });

/** The job's cached copy after a save, so leaving and coming back shows what was saved. */
export function rememberSavedDraft(qc: QueryClient, id: string, draft: BenchJobDraft, saved: BenchDraftSaved) {
  qc.setQueryData<BenchJob>(benchJobKeys.detail(id), (job) =>
    job ? { ...job, draft, version: saved.version, updatedAt: saved.savedAt } : job,
  );
}

export function useFinishBenchJob(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (version: number) => post<BenchJob>(`/api/bench-jobs/${id}/finish`, { version }),
    onSuccess: (job) => {
      qc.setQueryData(benchJobKeys.detail(id), job);
      // The board's page shows the new readings.
      return Promise.all([invalidateBenchLists(qc), qc.invalidateQueries({ queryKey: ['boards'] })]);
    },
  });
}

export function useUploadBenchPhoto(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ stepKey, file }: { stepKey: string; file: File }) => {
      const form = new FormData();
      form.set('stepKey', stepKey);
      form.set('photo', file);
      return postForm<BenchPhotoUploaded>(`/api/bench-jobs/${id}/photos`, form);
    },
    onSuccess: ({ photo }) =>
      qc.setQueryData<BenchJob>(benchJobKeys.detail(id), (job) => (job ? { ...job, photos: [...job.photos, photo] } : job)),
  });
}

function invalidateBenchLists(qc: QueryClient) {
  return qc.invalidateQueries({ queryKey: ['bench-jobs', 'list'] });
}
