import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { CompanySettings, SettingsUpdate } from '@bumperline/contracts/settings';
import { get, patch } from '../lib/api-client.ts';

export const settingsKeys = { all: ['settings'] as const };
export const settingsQuery = () =>
  queryOptions({ queryKey: settingsKeys.all, queryFn: () => get<CompanySettings>('/api/settings'), staleTime: 5 * 60_000 });
export const useSettings = () => useQuery(settingsQuery());

export function useSaveSettings() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: SettingsUpdate) => patch<CompanySettings>('/api/settings', body),
    onSuccess: (s) => qc.setQueryData(settingsKeys.all, s),
  });
}
