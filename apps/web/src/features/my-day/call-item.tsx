// A service call at the stop: its state in words, the next states as big buttons (queued, so they work offline), a
// note, and the parts fitted from the van.
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { callStateLabels, transitions, type CallState } from '@bumperline/contracts/call-vocabulary';
import { useEnqueueChange } from '../../api/technician-changes.ts';
import { paths } from '../../lib/paths.ts';
import type { ItemView } from './day-overlay.ts';
import { ItemStateBadge } from './item-state-badge.tsx';
import { AddPhoto } from './add-photo.tsx';
import { PartsUsedSection } from './parts-used-section.tsx';

/** A technician moves a call along; cancelling is the office's. */
const nextStates = (state: CallState) => transitions[state].filter((s) => s !== 'cancelled');

export function CallItem({ item, venueName }: { item: ItemView; venueName: string }) {
  const enqueue = useEnqueueChange();
  const [note, setNote] = useState('');
  const state = (item.pendingState ?? item.state) as CallState;
  const where = venueName;
  return (
    <div className="grid gap-3">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <Link to={paths.call(item.id)} className="link text-lg">
          {item.title}
        </Link>
        <ItemStateBadge item={item} />
      </div>
      {nextStates(state).length > 0 && (
        <div className="grid grid-cols-2 gap-2" role="group" aria-label="Move the call on">
          {nextStates(state).map((to) => (
            <button
              key={to}
              type="button"
              className="btn-secondary min-h-14 text-lg"
              onClick={() =>
                enqueue({
                  kind: 'call-transition',
                  callId: item.id,
                  version: item.version,
                  to,
                  label: { what: `${callStateLabels[to]}: ${item.title}`, where },
                })
              }
            >
              {callStateLabels[to]}
            </button>
          ))}
        </div>
      )}
      <AddPhoto callId={item.id} game={item.game.modelTitle} where={where} />
      <PartsUsedSection on="call" id={item.id} title={item.title} where={where} />
      <form
        className="grid gap-2"
        onSubmit={(e) => {
          e.preventDefault();
          if (!note.trim()) return;
          enqueue({ kind: 'call-note', callId: item.id, note: note.trim(), label: { what: `Note on ${item.title}`, where } });
          setNote('');
        }}
      >
        <label className="grid gap-1 font-semibold">
          Note for the call
          <textarea
            value={note}
            onChange={(e) => setNote(e.target.value)}
            rows={2}
            className="w-full rounded-md border border-paper-line bg-white px-3 py-2.5 text-base text-ink"
          />
        </label>
        <button type="submit" className="btn-secondary min-h-12" disabled={!note.trim()}>
          Add note
        </button>
      </form>
    </div>
  );
}
