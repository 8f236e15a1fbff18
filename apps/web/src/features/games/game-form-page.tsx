import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link, useNavigate, useParams, useSearchParams } from 'react-router-dom';
import type { z } from 'zod';
import { gameInput, gameModelInput, type Game } from '@bumperline/contracts/games';
import { gameKindLabels, gameKinds, gameStatusLabels, gameStatuses } from '@bumperline/contracts/game-vocabulary';
import { Field, inputClass } from '../../components/field.tsx';
import { PageHeader } from '../../components/page-header.tsx';
import { ErrorState, Loading } from '../../components/states.tsx';
import { applyServerErrors, fieldMessage } from '../../components/form-errors.ts';
import { ApiError } from '../../lib/api-client.ts';
import { paths } from '../../lib/paths.ts';
import { useCreateModel, useGame, useModels, useSaveGame } from '../../api/games.ts';
import { useVenues } from '../../api/venues.ts';

type FormIn = z.input<typeof gameInput>;
type FormOut = z.output<typeof gameInput>;
const FIELDS = ['modelId', 'venueId', 'serial', 'status', 'installedOn', 'pricePerPlayCents', 'notes'] as const;

export function NewGamePage() {
  const [sp] = useSearchParams();
  return <GameForm presetVenueId={sp.get('venue') ?? undefined} />;
}

export function EditGamePage() {
  const { id = '' } = useParams();
  const game = useGame(id);
  if (game.isLoading) return <Loading />;
  if (game.error || !game.data) return <ErrorState error={game.error} onRetry={() => game.refetch()} />;
  return <GameForm game={game.data} />;
}

function toForm(g?: Game, venueId?: string): FormIn {
  return g
    ? {
        modelId: g.modelId,
        venueId: g.venueId,
        serial: g.serial,
        status: g.status,
        installedOn: g.installedOn,
        pricePerPlayCents: g.pricePerPlayCents,
        notes: g.notes,
      }
    : { modelId: '', venueId: venueId ?? null, serial: '', status: 'running', installedOn: null, pricePerPlayCents: 100, notes: '' };
}

function GameForm({ game, presetVenueId }: { game?: Game; presetVenueId?: string }) {
  const navigate = useNavigate();
  const models = useModels();
  const venues = useVenues({ limit: 200, sort: 'name', order: 'asc' });
  const save = useSaveGame(game?.id);
  const [formError, setFormError] = useState<string | null>(null);
  const [addingModel, setAddingModel] = useState(false);
  const form = useForm<FormIn, unknown, FormOut>({ resolver: zodResolver(gameInput), defaultValues: toForm(game, presetVenueId) });
  const { register, handleSubmit, formState, setError, setValue } = form;
  const errors = formState.errors;

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      const saved = await save.mutateAsync(game ? { ...values, version: game.version } : values);
      navigate(paths.game(saved.id));
    } catch (err) {
      if (err instanceof ApiError && err.status === 409) setFormError(`${err.message} Reload the page to see them.`);
      else setFormError(applyServerErrors(err, setError, FIELDS));
    }
  });

  if (models.isLoading || venues.isLoading) return <Loading />;

  return (
    <>
      <PageHeader title={game ? `Edit ${game.model.title} · ${game.serial}` : 'Add a game'} />
      <div className="grid max-w-3xl gap-4">
        <form onSubmit={onSubmit} noValidate className="card grid gap-4">
          {formError && (
            <div role="alert" className="rounded-md border border-down bg-down-tint p-3 font-semibold text-down">
              {formError}
            </div>
          )}
          <div className="grid gap-4 sm:grid-cols-[1fr_auto] sm:items-end">
            <Field
              label="Model"
              error={fieldMessage(errors.modelId?.message === 'must be an id' ? 'Choose a model' : errors.modelId?.message)}
            >
              {(a) => (
                <select {...a} className={inputClass} {...register('modelId')}>
                  <option value="">Choose a model…</option>
                  {models.data?.items.map((m) => (
                    <option key={m.id} value={m.id}>
                      {m.maker} — {m.title}
                      {m.year ? ` (${m.year})` : ''}
                    </option>
                  ))}
                </select>
              )}
            </Field>
            <button type="button" className="btn-secondary" onClick={() => setAddingModel((x) => !x)} aria-expanded={addingModel}>
              New model
            </button>
          </div>
          <div className="grid gap-4 sm:grid-cols-2">
            <Field label="Serial number" error={fieldMessage(errors.serial?.message)}>
              {(a) => <input {...a} className={inputClass} {...register('serial')} />}
            </Field>
            <Field label="Venue" error={fieldMessage(errors.venueId?.message)}>
              {(a) => (
                <select {...a} className={inputClass} {...register('venueId', { setValueAs: (v: string) => v || null })}>
                  <option value="">Not placed (at the shop or in storage)</option>
                  {venues.data?.items.map((v) => (
                    <option key={v.id} value={v.id}>
                      {v.name}, {v.city}
                    </option>
                  ))}
                </select>
              )}
            </Field>
            <Field label="Status" error={fieldMessage(errors.status?.message)}>
              {(a) => (
                <select {...a} className={inputClass} {...register('status')}>
                  {gameStatuses.map((s) => (
                    <option key={s} value={s}>
                      {gameStatusLabels[s]}
                    </option>
                  ))}
                </select>
              )}
            </Field>
            <Field label="Installed on" error={fieldMessage(errors.installedOn?.message)}>
              {(a) => (
                <input {...a} type="date" className={inputClass} {...register('installedOn', { setValueAs: (v: string) => v || null })} />
              )}
            </Field>
            <Field
              label="Price per play (cents)"
              hint="For example 100 for one dollar"
              error={fieldMessage(errors.pricePerPlayCents?.message)}
            >
              {(a) => (
                <input {...a} inputMode="numeric" className={inputClass} {...register('pricePerPlayCents', { valueAsNumber: true })} />
              )}
            </Field>
          </div>
          <Field label="Notes" error={fieldMessage(errors.notes?.message)}>
            {(a) => <textarea {...a} rows={3} className={inputClass} {...register('notes')} />}
          </Field>
          <div className="flex gap-2">
            <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>
              {formState.isSubmitting ? 'Saving…' : game ? 'Save changes' : 'Add game'}
            </button>
            <Link to={game ? paths.game(game.id) : paths.games} className="btn-secondary">
              Cancel
            </Link>
          </div>
        </form>
        {addingModel && (
          <NewModelForm
            onCreated={(id) => {
              setValue('modelId', id);
              setAddingModel(false);
            }}
          />
        )}
      </div>
    </>
  );
}

function NewModelForm({ onCreated }: { onCreated: (id: string) => void }) {
  const create = useCreateModel();
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<z.input<typeof gameModelInput>, unknown, z.output<typeof gameModelInput>>({
    resolver: zodResolver(gameModelInput),
    defaultValues: { maker: '', title: '', kind: 'pinball', year: null },
  });
  const { register, handleSubmit, formState, setError } = form;
  const onSubmit = handleSubmit(async (values) => {
    try {
      const m = await create.mutateAsync(values);
      onCreated(m.id);
    } catch (err) {
      setFormError(applyServerErrors(err, setError, ['maker', 'title', 'kind', 'year']));
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="card grid gap-4" aria-label="New game model">
      <h2 className="text-lg font-bold">New game model</h2>
      {formError && (
        <p role="alert" className="font-semibold text-down">
          {formError}
        </p>
      )}
      <div className="grid gap-4 sm:grid-cols-2">
        <Field label="Maker" error={fieldMessage(formState.errors.maker?.message)}>
          {(a) => <input {...a} className={inputClass} {...register('maker')} />}
        </Field>
        <Field label="Title" error={fieldMessage(formState.errors.title?.message)}>
          {(a) => <input {...a} className={inputClass} {...register('title')} />}
        </Field>
        <Field label="Kind" error={fieldMessage(formState.errors.kind?.message)}>
          {(a) => (
            <select {...a} className={inputClass} {...register('kind')}>
              {gameKinds.map((k) => (
                <option key={k} value={k}>
                  {gameKindLabels[k]}
                </option>
              ))}
            </select>
          )}
        </Field>
        <Field label="Year" error={fieldMessage(formState.errors.year?.message)}>
          {(a) => (
            <input
              {...a}
              inputMode="numeric"
              className={inputClass}
              {...register('year', { setValueAs: (v: string) => (v === '' ? null : Number(v)) })}
            />
          )}
        </Field>
      </div>
      <button type="submit" className="btn-primary justify-self-start" disabled={formState.isSubmitting}>
        Add model
      </button>
    </form>
  );
}
