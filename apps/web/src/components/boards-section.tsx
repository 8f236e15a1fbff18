// The boards in a game, on the game's page: serial, date code as printed (flagged when it reads two ways), last
// recap and recap status, each linking to the board's page; a form to fit another of the model's boards; and the
// cabinet's temperature profile the recap dates follow.
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { CircleHelp, CircuitBoard, Plus } from 'lucide-react';
import type { BoardInstance, FittableBoard } from '@bumperline/contracts/boards';
import { useFitBoard, useGameBoards } from '../api/boards.ts';
import { useLocaleSettings } from '../api/me.ts';
import { useCan } from '../api/use-can.ts';
import { ApiError } from '../lib/api-client.ts';
import { formatDate } from '../lib/format.ts';
import { paths } from '../lib/paths.ts';
import { BoardFactsFields, boardFactsProblems, type BoardFactsDraft } from './board-facts-fields.tsx';
import { CabinetProfileEditor } from './cabinet-profile-editor.tsx';
import { Field, inputClass } from './field.tsx';
import { recapLine, RecapStatusBadge } from './recap-status-badge.tsx';
import { Empty, ErrorState, Loading } from './states.tsx';

export function BoardsSection({ gameId, modelTitle, canFit }: { gameId: string; modelTitle: string; canFit: boolean }) {
  const boards = useGameBoards(gameId);
  const canWrite = useCan('boards:write') && canFit;
  const [adding, setAdding] = useState(false);

  return (
    <section className="card lg:col-span-3" aria-labelledby="game-boards">
      <div className="mb-3 flex flex-wrap items-center justify-between gap-2">
        <h2 id="game-boards" className="flex items-center gap-2 text-lg font-bold">
          <CircuitBoard aria-hidden className="size-5" /> Boards
        </h2>
        {canWrite && !adding && !!boards.data?.modelBoards.length && (
          <button type="button" className="btn-secondary" onClick={() => setAdding(true)}>
            <Plus aria-hidden className="size-4" /> Add board
          </button>
        )}
      </div>
      <div className="grid gap-6 lg:grid-cols-[3fr_2fr]">
        <div>
          {boards.isLoading ? (
            <Loading />
          ) : boards.error || !boards.data ? (
            <ErrorState error={boards.error} onRetry={() => boards.refetch()} />
          ) : (
            <>
              {boards.data.items.length === 0 ? (
                <Empty title="No boards recorded for this game yet.">
                  {boards.data.modelBoards.length === 0 && (
                    <p className="max-w-prose text-sm">The {modelTitle} has no boards on record: add them with its parts lists first.</p>
                  )}
                </Empty>
              ) : (
                <ul className="divide-y divide-paper-line">
                  {boards.data.items.map((b) => (
                    <BoardLine key={b.id} board={b} />
                  ))}
                </ul>
              )}
              {adding && <FitBoardForm gameId={gameId} boards={boards.data.modelBoards} onDone={() => setAdding(false)} />}
            </>
          )}
        </div>
        <CabinetProfileEditor gameId={gameId} />
      </div>
    </section>
  );
}

function BoardLine({ board }: { board: BoardInstance }) {
  const locale = useLocaleSettings();
  return (
    <li className="py-3">
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div>
          <Link className="link text-lg" to={paths.boardInstance(board.id)}>
            {board.boardName}
          </Link>
          {board.boardPartNumber && <span className="ml-2 text-sm text-ink-muted tabular">{board.boardPartNumber}</span>}
        </div>
        <RecapStatusBadge status={board.recap.status} />
      </div>
      <dl className="mt-1 flex flex-wrap gap-x-5 gap-y-1 text-sm">
        <div className="flex gap-1">
          <dt className="font-semibold">Serial</dt>
          <dd className="tabular">{board.serial || '—'}</dd>
        </div>
        <div className="flex gap-1">
          <dt className="font-semibold">Date code</dt>
          <dd className="tabular">
            {board.dateCode || '—'}
            {board.madeOn && <span className="text-ink-muted"> (made {formatDate(board.madeOn, locale)})</span>}
          </dd>
        </div>
        <div className="flex gap-1">
          <dt className="font-semibold">Last recap</dt>
          <dd>{board.lastRecapOn ? formatDate(board.lastRecapOn, locale) : 'none on record'}</dd>
        </div>
      </dl>
      {board.dateCodeFlag && (
        <p className="mt-1 flex items-start gap-1 text-sm font-semibold text-shop">
          <CircleHelp aria-hidden className="mt-0.5 size-4 shrink-0" />
          <span>Date code reads two ways: {board.dateCodeFlag}</span>
        </p>
      )}
      <p className="mt-1 text-sm text-ink-soft">{recapLine(board.recap, locale)}</p>
    </li>
  );
}

function FitBoardForm({ gameId, boards, onDone }: { gameId: string; boards: FittableBoard[]; onDone: () => void }) {
  const fit = useFitBoard(gameId);
  const [boardId, setBoardId] = useState(boards.length === 1 ? boards[0]!.id : '');
  const [facts, setFacts] = useState<BoardFactsDraft>({ serial: '', dateCode: '', lastRecapOn: '' });
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);

  return (
    <form
      className="mt-4 grid gap-3 border-t border-paper-line pt-4 sm:grid-cols-2"
      noValidate
      onSubmit={(e) => {
        e.preventDefault();
        setFormError(null);
        const problems: Record<string, string> = boardFactsProblems(facts);
        if (!boardId) problems.boardId = 'pick which board this is';
        setErrors(problems);
        if (Object.keys(problems).length) return;
        fit.mutate(
          { boardId, ...facts, lastRecapOn: facts.lastRecapOn || null },
          {
            onSuccess: onDone,
            onError: (err) => {
              if (err instanceof ApiError && err.problem.errors?.length) setErrors(err.fieldErrors());
              else setFormError(err instanceof ApiError ? err.message : 'Could not add the board.');
            },
          },
        );
      }}
    >
      <h3 className="font-bold sm:col-span-2">Add a board to this game</h3>
      <Field label="Board" error={errors.boardId}>
        {(p) => (
          <select {...p} className={inputClass} value={boardId} onChange={(e) => setBoardId(e.target.value)}>
            <option value="">Pick one of the model’s boards</option>
            {boards.map((b) => (
              <option key={b.id} value={b.id}>
                {b.name}
                {b.partNumber ? ` (${b.partNumber})` : ''}
              </option>
            ))}
          </select>
        )}
      </Field>
      <BoardFactsFields facts={facts} errors={errors} onChange={setFacts} />
      {formError && (
        <p role="alert" className="font-semibold text-down sm:col-span-2">
          {formError}
        </p>
      )}
      <div className="flex flex-wrap gap-2 sm:col-span-2">
        <button type="submit" className="btn-primary" disabled={fit.isPending}>
          Add board
        </button>
        <button type="button" className="btn-secondary" onClick={onDone}>
          Cancel
        </button>
      </div>
    </form>
  );
}
