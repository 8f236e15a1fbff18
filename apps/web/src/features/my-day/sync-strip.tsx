// The strip above the day: how many changes have not reached the office (tap → the list), and, without signal, that
// the day shown is the copy saved on the phone and when it was saved.
import { AlertTriangle, CloudOff, CloudUpload } from 'lucide-react';
import { Link } from 'react-router-dom';
import { usePendingChanges } from '../../api/technician-changes.ts';
import { useFailedChanges } from '../../lib/failed-changes.ts';
import { paths } from '../../lib/paths.ts';
import { useOnline } from './use-online.ts';

export function SyncStrip({ savedAt, timeZone, locale }: { savedAt: number; timeZone: string; locale: string }) {
  const online = useOnline();
  const pending = usePendingChanges().length;
  const failed = useFailedChanges().length;
  const saved = savedAt
    ? new Intl.DateTimeFormat(locale, { hour: '2-digit', minute: '2-digit', hour12: false, timeZone }).format(new Date(savedAt))
    : null;
  if (online && pending === 0 && failed === 0) return null;
  return (
    <div className="mb-4 grid gap-2" aria-live="polite">
      {!online && (
        <p className="flex items-center gap-2 rounded-lg border-2 border-ink-muted bg-paper px-3 py-2 font-bold text-ink">
          <CloudOff aria-hidden className="size-5 shrink-0" />
          Offline — showing the day as saved{saved ? ` at ${saved}` : ''}.
        </p>
      )}
      {failed > 0 && (
        <Link
          to={paths.myChanges}
          className="flex min-h-12 items-center gap-2 rounded-lg border-2 border-down bg-down-tint px-3 py-2 font-bold text-down"
        >
          <AlertTriangle aria-hidden className="size-5 shrink-0" />
          {failed} {failed === 1 ? 'change needs' : 'changes need'} your decision
        </Link>
      )}
      {pending > 0 && (
        <Link
          to={paths.myChanges}
          className="flex min-h-12 items-center gap-2 rounded-lg border-2 border-attention bg-attention-tint px-3 py-2 font-bold text-attention"
        >
          <CloudUpload aria-hidden className="size-5 shrink-0" />
          {pending} {pending === 1 ? 'change' : 'changes'} not sent yet
          {online ? ' — sending' : ' — they go when there is signal'}
        </Link>
      )}
    </div>
  );
}
