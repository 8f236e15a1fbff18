// Every model of the company with its boards; a board opens its parts list, and a model takes a new board.
import { useId, useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { CircuitBoard, Plus } from 'lucide-react';
import { gameKindLabels } from '@bumperline/contracts/game-vocabulary';
import type { ModelWithBoards } from '@bumperline/contracts/parts-lists';
import { PageHeader } from '../../components/page-header.tsx';
import { Empty, ErrorState, Loading } from '../../components/states.tsx';
import { inputClass } from '../../components/field.tsx';
import { fieldMessage } from '../../components/form-errors.ts';
import { ApiError } from '../../lib/api-client.ts';
import { paths } from '../../lib/paths.ts';
import { useCan } from '../../api/use-can.ts';
import { useCreateBoard, usePartsListsOverview } from '../../api/parts-lists.ts';

export function PartsListsPage() {
  const overview = usePartsListsOverview();
  const canWrite = useCan('parts-lists:write');

  if (overview.isLoading) return <Loading />;
  if (overview.error || !overview.data) return <ErrorState error={overview.error} onRetry={() => overview.refetch()} />;
  // Models whose boards are listed come first (in the API's maker and title order), then the rest.
  const models = [...overview.data.items].sort((a, b) => Number(b.boards.length > 0) - Number(a.boards.length > 0));

  return (
    <>
      <PageHeader title="Parts lists" subtitle="Each model's boards, and every part on them with its value, tolerance and rating." />
      {models.length === 0 ? (
        <div className="card">
          <Empty title="No game models yet.">
            <p>Add a game with its model first; its boards and parts lists are kept here.</p>
          </Empty>
        </div>
      ) : (
        <ul className="grid gap-4 lg:grid-cols-2">
          {models.map((m) => (
            <li key={m.model.id}>
              <ModelCard entry={m} canWrite={canWrite} />
            </li>
          ))}
        </ul>
      )}
    </>
  );
}

function ModelCard({ entry, canWrite }: { entry: ModelWithBoards; canWrite: boolean }) {
  const { model, boards } = entry;
  const headingId = useId();
  return (
    <section className="card h-full" aria-labelledby={headingId}>
      <h2 id={headingId} className="text-lg font-bold">
        {model.title}
      </h2>
      <p className="text-ink-soft">
        {model.maker} · {gameKindLabels[model.kind]}
        {model.year ? ` · ${model.year}` : ''}
      </p>
      {boards.length === 0 ? (
        <p className="mt-3 text-ink-muted">No boards listed yet.</p>
      ) : (
        <ul className="mt-3 divide-y divide-paper-line border-y border-paper-line">
          {boards.map((b) => (
            <li key={b.id} className="flex flex-wrap items-center justify-between gap-x-4 gap-y-1 py-2">
              <Link className="link inline-flex min-h-11 items-center gap-2" to={paths.partsList(b.id)}>
                <CircuitBoard aria-hidden className="size-4 shrink-0" />
                {b.name}
              </Link>
              <span className="tabular text-ink-soft">
                {b.partNumber && <span className="mr-3">{b.partNumber}</span>}
                {b.partCount === 1 ? '1 part' : `${b.partCount} parts`}
              </span>
            </li>
          ))}
        </ul>
      )}
      {canWrite && <AddBoardForm modelId={model.id} modelTitle={model.title} />}
    </section>
  );
}

function AddBoardForm({ modelId, modelTitle }: { modelId: string; modelTitle: string }) {
  const [open, setOpen] = useState(false);
  const [name, setName] = useState('');
  const [partNumber, setPartNumber] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const create = useCreateBoard(modelId);
  const navigate = useNavigate();
  const id = useId();

  if (!open) {
    return (
      <button type="button" className="btn-secondary mt-3" onClick={() => setOpen(true)}>
        <Plus aria-hidden className="size-4" /> Add a board
      </button>
    );
  }

  return (
    <form
      className="mt-3 grid gap-3 rounded-md border border-paper-line bg-paper-dim p-3 sm:grid-cols-[1fr_1fr_auto] sm:items-end"
      aria-label={`Add a board to ${modelTitle}`}
      noValidate
      onSubmit={async (e) => {
        e.preventDefault();
        setErrors({});
        try {
          const board = await create.mutateAsync({ name, partNumber });
          navigate(paths.partsList(board.id));
        } catch (err) {
          setErrors(err instanceof ApiError ? { form: err.message, ...err.fieldErrors() } : { form: 'Something went wrong. Try again.' });
        }
      }}
    >
      <div className="flex flex-col gap-1">
        <label htmlFor={`${id}-name`} className="font-semibold">
          Board name
        </label>
        <input
          id={`${id}-name`}
          className={inputClass}
          value={name}
          placeholder="Power supply"
          aria-invalid={!!errors.name}
          aria-describedby={errors.name ? `${id}-name-error` : undefined}
          onChange={(e) => setName(e.target.value)}
        />
        {errors.name && (
          <p id={`${id}-name-error`} className="text-sm font-semibold text-down">
            {fieldMessage(errors.name)}
          </p>
        )}
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor={`${id}-pn`} className="font-semibold">
          Part number <span className="font-normal text-ink-muted">(optional)</span>
        </label>
        <input id={`${id}-pn`} className={inputClass} value={partNumber} onChange={(e) => setPartNumber(e.target.value)} />
      </div>
      <div className="flex gap-2">
        <button type="submit" className="btn-primary" disabled={create.isPending}>
          {create.isPending ? 'Adding…' : 'Add'}
        </button>
        <button type="button" className="btn-secondary" onClick={() => setOpen(false)}>
          Cancel
        </button>
      </div>
      {errors.form && !errors.name && (
        <p role="alert" className="font-semibold text-down sm:col-span-3">
          {errors.form}
        </p>
      )}
    </form>
  );
}
