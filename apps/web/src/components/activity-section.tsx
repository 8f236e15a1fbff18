// The "who changed what" section of a record's page, shown to those who may read the audit log.
import { useActivity } from '../api/activity.ts';
import { useLocaleSettings } from '../api/me.ts';
import { useCan } from '../api/use-can.ts';
import { ActivityList } from './activity-list.tsx';
import { Empty, Loading } from './states.tsx';

export function ActivitySection({ entityId, title }: { entityId: string; title: string }) {
  const canAudit = useCan('audit:read');
  const activity = useActivity({ entityId }, canAudit);
  const locale = useLocaleSettings();
  if (!canAudit) return null;
  const headingId = `activity-${entityId}`;
  return (
    <section className="card lg:col-span-3" aria-labelledby={headingId}>
      <h2 id={headingId} className="mb-3 text-lg font-bold">
        {title}
      </h2>
      {activity.isLoading ? (
        <Loading />
      ) : activity.data?.items.length ? (
        <ActivityList items={activity.data.items} locale={locale} />
      ) : (
        <Empty title="No changes recorded yet." />
      )}
    </section>
  );
}
