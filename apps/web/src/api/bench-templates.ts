// Bench-job template endpoints: fetchers, query-option factories (the only place their keys live) and hooks.
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { BenchTemplate, BenchTemplateInput, BenchTemplateList, BenchTemplateUpdate } from '@bumperline/contracts/bench-jobs';
import { get, post, put } from '../lib/api-client.ts';

export const benchTemplateKeys = {
  all: ['bench-templates'] as const,
  list: ['bench-templates', 'list'] as const,
  detail: (id: string) => ['bench-templates', 'detail', id] as const,
};

export const benchTemplatesQuery = () =>
  queryOptions({ queryKey: benchTemplateKeys.list, queryFn: () => get<BenchTemplateList>('/api/bench-templates'), staleTime: 60_000 });
export const benchTemplateQuery = (id: string) =>
  queryOptions({ queryKey: benchTemplateKeys.detail(id), queryFn: () => get<BenchTemplate>(`/api/bench-templates/${id}`) });

export const useBenchTemplates = () => useQuery(benchTemplatesQuery());
export const useBenchTemplate = (id: string, enabled = true) => useQuery({ ...benchTemplateQuery(id), enabled });

/** Creates a template, or replaces one whole (steps in their new order) at the version it was loaded at. */
export function useSaveBenchTemplate(id?: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: BenchTemplateInput | BenchTemplateUpdate) =>
      id ? put<BenchTemplate>(`/api/bench-templates/${id}`, body) : post<BenchTemplate>('/api/bench-templates', body),
    onSuccess: (template) => {
      qc.setQueryData(benchTemplateKeys.detail(template.id), template);
      return qc.invalidateQueries({ queryKey: benchTemplateKeys.list });
    },
  });
}
