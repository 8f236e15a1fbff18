// Every change not yet at the office, in words and in the order it will be sent, and the ones the office turned
// down. A conflict (the office changed the same record meanwhile) shows both sides; the technician sends theirs again
// on top of the office's version, or drops it. Nothing is overwritten or dropped without them.
import { AlertTriangle, CheckCircle2, CloudOff, CloudUpload, Loader2 } from 'lucide-react';
import { useQueryClient } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { useLocaleSettings } from '../../api/me.ts';
import { dropChange, sendAgain, usePendingChanges } from '../../api/technician-changes.ts';
import { PageHeader } from '../../components/page-header.tsx';
import { useFailedChanges, type FailedChange } from '../../lib/failed-changes.ts';
import { asSentence, defaultLocale } from '../../lib/format.ts';
import { paths } from '../../lib/paths.ts';
import { changeLine, queuedAtText } from '../../lib/queued-change.ts';
import { officeFacts, sentFacts, type Fact } from './conflict-facts.ts';
import { useOnline } from './use-online.ts';
import { QueuedPhotoThumb } from './queued-photo-thumb.tsx';

function Facts({ title, facts }: { title: string; facts: Fact[] }) {
  return (
    <div className="rounded-md border border-paper-line bg-paper p-3">
      <h3 className="font-extrabold text-ink">{title}</h3>
      {facts.length === 0 ? (
        <p className="text-ink-muted">Nothing to compare.</p>
      ) : (
        <dl className="mt-1 grid grid-cols-[auto_1fr] gap-x-3 gap-y-1">
          {facts.map(([label, value]) => (
            <div key={label} className="contents">
              <dt className="text-ink-soft">{label}</dt>
              <dd className="font-semibold break-words text-ink">{value}</dd>
            </div>
          ))}
        </dl>
      )}
    </div>
  );
}

function FailedCard({ failed, time }: { failed: FailedChange; time: string }) {
  const qc = useQueryClient();
  const conflict = failed.action === 'conflict';
  return (
    <li className="card grid gap-3 border-2 border-down">
      <p className="flex items-start gap-2 font-bold text-down">
        <AlertTriangle aria-hidden className="mt-0.5 size-5 shrink-0" />
        {conflict ? 'The office changed this while you were working on it' : 'The office could not take this change'}
      </p>
      <p className="text-lg font-extrabold break-words text-ink">{changeLine(failed.change)}</p>
      <p className="text-ink-soft">
        Queued {time}. {asSentence(failed.message)}
      </p>
      {conflict && (
        <div className="grid gap-2 sm:grid-cols-2">
          <Facts title="The office has now" facts={officeFacts(failed.current)} />
          <Facts title="You sent" facts={sentFacts(failed.change)} />
        </div>
      )}
      <div className="grid grid-cols-2 gap-2">
        {conflict && (
          <button
            type="button"
            className="btn-primary min-h-14 text-lg"
            onClick={() => sendAgain(qc, failed.change, failed.currentVersion)}
          >
            Send mine again
          </button>
        )}
        <button type="button" className="btn-danger min-h-14 text-lg" onClick={() => dropChange(failed.change)}>
          Drop mine
        </button>
      </div>
    </li>
  );
}

export function ChangesPage() {
  const pending = usePendingChanges();
  const failed = useFailedChanges();
  const online = useOnline();
  const locale = useLocaleSettings() ?? defaultLocale;
  const at = (c: { queuedAt: string }) => queuedAtText(c, locale.locale, locale.timeZone);
  const nothing = pending.length === 0 && failed.length === 0;

  return (
    <div className="mx-auto grid max-w-3xl gap-4">
      <PageHeader
        title="Changes not sent yet"
        subtitle={
          online ? 'They are sent in the order you made them.' : 'Offline: they are kept on this phone and sent when there is signal.'
        }
      />
      {nothing && (
        <div className="card flex flex-col items-center gap-2 py-8 text-center">
          <CheckCircle2 aria-hidden className="size-8 text-running" />
          <p className="font-bold text-ink">Everything has reached the office.</p>
          <Link to={paths.myDay} className="link">
            Back to My day
          </Link>
        </div>
      )}
      {failed.length > 0 && (
        <section aria-labelledby="failed" className="grid gap-3">
          <h2 id="failed" className="text-lg font-extrabold text-ink">
            Needs your decision ({failed.length})
          </h2>
          <ul className="grid gap-3">
            {failed.map((f) => (
              <FailedCard key={f.change.key} failed={f} time={at(f.change)} />
            ))}
          </ul>
        </section>
      )}
      {pending.length > 0 && (
        <section aria-labelledby="pending" className="grid gap-3">
          <h2 id="pending" className="text-lg font-extrabold text-ink">
            {pending.length} {pending.length === 1 ? 'change' : 'changes'} not sent
          </h2>
          <ol className="grid gap-2">
            {pending.map(({ change, paused, attempts }) => (
              <li key={change.key} className="card flex items-start gap-3">
                {paused ? (
                  <CloudOff aria-hidden className="mt-0.5 size-5 shrink-0 text-ink-muted" />
                ) : attempts > 0 ? (
                  <CloudUpload aria-hidden className="mt-0.5 size-5 shrink-0 text-attention" />
                ) : (
                  <Loader2 aria-hidden className="mt-0.5 size-5 shrink-0 animate-spin text-ink-muted" />
                )}
                {change.kind === 'call-photo' && <QueuedPhotoThumb photoKey={change.photoKey} />}
                <div className="min-w-0">
                  <p className="font-bold break-words text-ink">{changeLine(change)}</p>
                  <p className="text-ink-soft">
                    Queued {at(change)} · {paused ? 'waiting for signal' : attempts > 0 ? `trying again (${attempts})` : 'sending'}
                  </p>
                </div>
              </li>
            ))}
          </ol>
        </section>
      )}
    </div>
  );
}
