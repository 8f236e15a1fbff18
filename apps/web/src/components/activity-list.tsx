// A readable audit trail: who did what, when, and which fields changed.
import type { ActivityEntry } from '@bumperline/contracts/activity';
import { formatDateTime } from '../lib/format.ts';

const actionWords: Record<string, string> = {
  create: 'created',
  update: 'changed',
  retire: 'retired',
  invite: 'invited',
  revoke: 'withdrew',
  remove: 'removed',
  join: 'joined',
};

function show(v: unknown): string {
  if (v === null || v === undefined || v === '') return '—';
  if (typeof v === 'object') return JSON.stringify(v);
  return String(v);
}

export function ActivityList({
  items,
  locale,
}: {
  items: ActivityEntry[];
  locale?: { locale: string; timeZone: string; currency: string };
}) {
  return (
    <ol className="grid gap-3">
      {items.map((e) => {
        const changed = Object.entries(e.changes).filter(([k]) => k !== 'id');
        return (
          <li key={e.id} className="border-l-4 border-brass-bright pl-3">
            <p>
              <span className="font-bold">{e.actorName ?? 'Someone'}</span> {actionWords[e.action] ?? e.action} {e.entity.replace('_', ' ')}
              <span className="text-ink-muted"> · {formatDateTime(e.at, locale)}</span>
            </p>
            {e.action === 'update' && changed.length > 0 && (
              <ul className="mt-1 text-sm text-ink-soft">
                {changed.slice(0, 6).map(([field, c]) => (
                  <li key={field}>
                    {field}: {show(c.from)} → {show(c.to)}
                  </li>
                ))}
              </ul>
            )}
          </li>
        );
      })}
    </ol>
  );
}
