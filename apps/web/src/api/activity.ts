import { queryOptions, useQuery } from '@tanstack/react-query';
import { get } from '../lib/api-client.ts';

export interface ActivityEntry {
  id: number;
  at: string;
  action: string;
  entity: string;
  entityId: string;
  changes: Record<string, { from: unknown; to: unknown }>;
  actorName: string | null;
}

export const activityKeys = { list: (f: { entityId?: string; before?: number }) => ['activity', f] as const };

export const activityQuery = (f: { entityId?: string; before?: number }) =>
  queryOptions({
    queryKey: activityKeys.list(f),
    queryFn: () => get<{ items: ActivityEntry[]; nextBefore: number | null }>('/api/activity', { ...f, limit: 50 }),
  });

export const useActivity = (f: { entityId?: string; before?: number }, enabled = true) => useQuery({ ...activityQuery(f), enabled });
