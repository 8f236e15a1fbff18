// A model's board: its name and part number, and its parts list in the editor.
import { useId, useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { ArrowLeft, Pencil } from 'lucide-react';
import type { BoardPartsList } from '@bumperline/contracts/parts-lists';
import { PageHeader } from '../../components/page-header.tsx';
import { ErrorState, Loading } from '../../components/states.tsx';
import { inputClass } from '../../components/field.tsx';
import { fieldMessage } from '../../components/form-errors.ts';
import { ApiError } from '../../lib/api-client.ts';
import { paths } from '../../lib/paths.ts';
import { useCan } from '../../api/use-can.ts';
import { useBoardPartsList, useUpdateBoard } from '../../api/parts-lists.ts';
import { PartsListEditor } from './parts-list-editor.tsx';

export function PartsListPage() {
  const { boardId = '' } = useParams();
  const list = useBoardPartsList(boardId);
  const canWrite = useCan('parts-lists:write');
  const [editing, setEditing] = useState(false);

  // The editor opens on the list as it is now, not on what this browser saw last time.
  if (list.isLoading || (list.isFetching && !list.isFetchedAfterMount)) return <Loading />;
  if (list.error || !list.data) return <ErrorState error={list.error} onRetry={() => list.refetch()} />;
  const { board, model } = list.data;

  return (
    <>
      <Link to={paths.partsLists} className="link mb-2 inline-flex min-h-11 items-center gap-1">
        <ArrowLeft aria-hidden className="size-4" /> Parts lists
      </Link>
      <PageHeader
        title={`${model.title} · ${board.name}`}
        subtitle={
          <>
            {model.maker}
            {board.partNumber && (
              <>
                {' '}
                ·{' '}
                <span className="whitespace-nowrap">
                  part number <span className="tabular">{board.partNumber}</span>
                </span>
              </>
            )}
            {board.notes && <span className="mt-1 block">{board.notes}</span>}
          </>
        }
        actions={
          canWrite &&
          !editing && (
            <button type="button" className="btn-secondary" onClick={() => setEditing(true)}>
              <Pencil aria-hidden className="size-4" /> Board details
            </button>
          )
        }
      />
      {editing && <BoardDetailsForm list={list.data} onDone={() => setEditing(false)} />}
      <PartsListEditor key={board.id} list={list.data} readOnly={!canWrite} />
    </>
  );
}

function BoardDetailsForm({ list, onDone }: { list: BoardPartsList; onDone(): void }) {
  const { board } = list;
  const [values, setValues] = useState({ name: board.name, partNumber: board.partNumber, notes: board.notes });
  const [errors, setErrors] = useState<Record<string, string>>({});
  const update = useUpdateBoard(board.id);
  const id = useId();
  const field = (name: keyof typeof values, label: string, multiline = false) => {
    const error = errors[name];
    const props = {
      id: `${id}-${name}`,
      className: inputClass,
      value: values[name],
      'aria-invalid': !!error,
      'aria-describedby': error ? `${id}-${name}-error` : undefined,
      onChange: (e: { target: { value: string } }) => setValues((v) => ({ ...v, [name]: e.target.value })),
    };
    return (
      <div className={`flex flex-col gap-1 ${multiline ? 'sm:col-span-2' : ''}`}>
        <label htmlFor={props.id} className="font-semibold">
          {label}
        </label>
        {multiline ? <textarea rows={2} {...props} /> : <input {...props} />}
        {error && (
          <p id={`${id}-${name}-error`} className="text-sm font-semibold text-down">
            {fieldMessage(error)}
          </p>
        )}
      </div>
    );
  };
  return (
    <form
      className="card mb-4 grid max-w-3xl gap-3 sm:grid-cols-2"
      aria-label="Board details"
      noValidate
      onSubmit={async (e) => {
        e.preventDefault();
        setErrors({});
        try {
          await update.mutateAsync(values);
          onDone();
        } catch (err) {
          setErrors(err instanceof ApiError ? { form: err.message, ...err.fieldErrors() } : { form: 'Something went wrong. Try again.' });
        }
      }}
    >
      {field('name', 'Board name')}
      {field('partNumber', 'Part number')}
      {field('notes', 'Notes', true)}
      {errors.form && Object.keys(errors).length === 1 && (
        <p role="alert" className="font-semibold text-down sm:col-span-2">
          {errors.form}
        </p>
      )}
      <div className="flex gap-2 sm:col-span-2">
        <button type="submit" className="btn-primary" disabled={update.isPending}>
          {update.isPending ? 'Saving…' : 'Save details'}
        </button>
        <button type="button" className="btn-secondary" onClick={onDone}>
          Cancel
        </button>
      </div>
    </form>
  );
}
