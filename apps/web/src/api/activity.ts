import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ActivityPage } from '@bumperline/contracts/activity';
import { get } from '../lib/api-client.ts';

export const activityKeys = { list: (f: { entityId?: string; before?: number }) => ['activity', f] as const };

export const activityQuery = (f: { entityId?: string; before?: number }) =>
  queryOptions({
    queryKey: activityKeys.list(f),
    queryFn: () => get<ActivityPage>('/api/activity', { ...f, limit: 50 }),
  });

export const useActivity = (f: { entityId?: string; before?: number }, enabled = true) => useQuery({ ...activityQuery(f), enabled });
