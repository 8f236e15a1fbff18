import { useState } from 'react';
import { PageHeader } from '../../components/page-header.tsx';
import { ActivityList } from '../../components/activity-list.tsx';
import { Empty, ErrorState, Loading } from '../../components/states.tsx';
import { useActivity } from '../../api/activity.ts';
import { useLocaleSettings } from '../../api/me.ts';

export function ActivityPage() {
  const [before, setBefore] = useState<number[]>([]);
  const activity = useActivity({ before: before[before.length - 1] });
  const locale = useLocaleSettings();
  return (
    <>
      <PageHeader title="Activity" subtitle="Every change in this company: who, what and when." />
      <section className="card">
        {activity.isLoading ? (
          <Loading />
        ) : activity.error ? (
          <ErrorState error={activity.error} onRetry={() => activity.refetch()} />
        ) : !activity.data?.items.length ? (
          <Empty title="Nothing has changed yet." />
        ) : (
          <ActivityList items={activity.data.items} locale={locale} />
        )}
        <div className="mt-4 flex justify-end gap-2">
          <button type="button" className="btn-secondary" disabled={!before.length} onClick={() => setBefore((b) => b.slice(0, -1))}>
            Newer
          </button>
          <button
            type="button"
            className="btn-secondary"
            disabled={!activity.data?.nextBefore}
            onClick={() => activity.data?.nextBefore && setBefore((b) => [...b, activity.data!.nextBefore!])}
          >
            Older
          </button>
        </div>
      </section>
    </>
  );
}
