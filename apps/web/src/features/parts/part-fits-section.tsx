// The parts-list entries a catalogue part fits (board, model, designator, value), and, for the office, linking it
// to another entry: choose a board, then the entry.
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Link2, Unlink } from 'lucide-react';
import type { PartFit } from '@bumperline/contracts/parts-catalogue';
import { useLinkFit } from '../../api/parts-catalogue.ts';
import { useQuery } from '@tanstack/react-query';
import { boardPartsListQuery, usePartsListsOverview } from '../../api/parts-lists.ts';
import { inputClass } from '../../components/field.tsx';
import { Empty } from '../../components/states.tsx';
import { ApiError } from '../../lib/api-client.ts';
import { paths } from '../../lib/paths.ts';

export function PartFitsSection({ partId, fits, canManage }: { partId: string; fits: PartFit[]; canManage: boolean }) {
  const link = useLinkFit(partId);
  const [boardId, setBoardId] = useState('');
  const [boardPartId, setBoardPartId] = useState('');
  const [error, setError] = useState<string | null>(null);
  const overview = usePartsListsOverview();
  const board = useQuery({ ...boardPartsListQuery(boardId), enabled: !!boardId });
  const boards = (overview.data?.items ?? []).flatMap((m) =>
    m.boards.map((b) => ({ id: b.id, label: `${m.model.maker} ${m.model.title} — ${b.name}` })),
  );

  async function send(v: { boardPartId: string; link: boolean }) {
    setError(null);
    try {
      await link.mutateAsync(v);
      setBoardPartId('');
    } catch (err) {
      setError(err instanceof ApiError ? err.message : 'Could not change the link.');
    }
  }

  return (
    <section className="card grid gap-3" aria-labelledby="fits-heading">
      <h2 id="fits-heading" className="text-lg font-bold">
        Fits these parts-list entries
      </h2>
      {fits.length === 0 ? (
        <Empty title="Not linked to any parts list yet." />
      ) : (
        <ul className="divide-y divide-paper-line">
          {fits.map((f) => (
            <li key={f.boardPartId} className="flex flex-wrap items-center justify-between gap-2 py-2">
              <span>
                <span className="font-semibold">{f.designator}</span> ({f.value}) on{' '}
                <Link className="link" to={paths.partsList(f.boardId)}>
                  {f.boardName}
                </Link>{' '}
                of {f.modelName}
              </span>
              {canManage && (
                <button
                  type="button"
                  className="btn-secondary"
                  disabled={link.isPending}
                  onClick={() => void send({ boardPartId: f.boardPartId, link: false })}
                >
                  <Unlink aria-hidden className="size-4" /> Unlink {f.designator}
                </button>
              )}
            </li>
          ))}
        </ul>
      )}
      {canManage && (
        <div className="grid gap-2 border-t border-paper-line pt-3 md:grid-cols-[1fr_1fr_auto] md:items-end">
          <label className="grid gap-1">
            <span className="font-semibold">Board</span>
            <select className={inputClass} value={boardId} onChange={(e) => (setBoardId(e.target.value), setBoardPartId(''))}>
              <option value="">Choose a board…</option>
              {boards.map((b) => (
                <option key={b.id} value={b.id}>
                  {b.label}
                </option>
              ))}
            </select>
          </label>
          <label className="grid gap-1">
            <span className="font-semibold">Entry</span>
            <select className={inputClass} value={boardPartId} disabled={!boardId} onChange={(e) => setBoardPartId(e.target.value)}>
              <option value="">{board.isLoading ? 'Loading…' : 'Choose an entry…'}</option>
              {(board.data?.parts ?? []).map((p) => (
                <option key={p.id} value={p.id}>
                  {p.designator} — {p.value}
                </option>
              ))}
            </select>
          </label>
          <button
            type="button"
            className="btn-primary"
            disabled={!boardPartId || link.isPending}
            onClick={() => void send({ boardPartId, link: true })}
          >
            <Link2 aria-hidden className="size-4" /> Link
          </button>
        </div>
      )}
      {error && (
        <p role="alert" className="font-semibold text-down">
          {error}
        </p>
      )}
    </section>
  );
}
