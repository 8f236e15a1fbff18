/**
 * Picks a catalogue part and a quantity for a job: search the catalogue by part number or description, see how
 * many the van holds, type how many were fitted, add. It records nothing itself: `onAdd` does (the stop screen
 * queues it for when the phone has signal; an office screen posts it straight away).
 *
 * Props:
 * - `locationId` — the stock the parts come from (the technician's van): its quantity shows beside each part, and
 *   asking for more than it holds is stopped here with the same words as the API ("only 3 on the van"). Null: no
 *   quantities shown, nothing stopped (the API still refuses).
 * - `suggestions` — catalogue parts to offer before any search, e.g. those fitting the board's parts list
 *   (GET /api/boards/:boardId/catalogue-fits); `note` is shown under the part (a designator: "fits F1").
 * - `onAdd({ cataloguePartId, quantity, part })` — called with a checked quantity; may return a promise (the picker
 *   clears when it resolves, and shows the error's message when it rejects).
 * - `error` — a message to show under the picker (the last failed add, from the caller's own mutation).
 * - `disabled` — e.g. while the job is closed.
 */
import { useId, useState } from 'react';
import { Plus, Search } from 'lucide-react';
import type { CataloguePart } from '@bumperline/contracts/parts-catalogue';
import type { StockUnit } from '@bumperline/contracts/stock-vocabulary';
import { useParts } from '../api/parts-catalogue.ts';
import { ApiError } from '../lib/api-client.ts';
import { asSentence } from '../lib/format.ts';
import { formatQuantity, readQuantity } from '../lib/quantity-entry.ts';
import { inputClass } from './field.tsx';

export interface PickedPart {
  cataloguePartId: string;
  partNumber: string;
  description: string;
  unit: StockUnit;
  /** Held at the picker's stock (null: unknown). */
  quantity: number | null;
  note?: string;
}

export interface PartsUsedPickerProps {
  locationId: string | null;
  suggestions?: readonly PickedPart[];
  onAdd: (pick: { cataloguePartId: string; quantity: number; part: PickedPart }) => void | Promise<unknown>;
  error?: string | null;
  disabled?: boolean;
  /** The heading of the picker ("Add a part used"). */
  label?: string;
}

const fromCatalogue = (p: CataloguePart): PickedPart => ({
  cataloguePartId: p.id,
  partNumber: p.partNumber,
  description: p.description,
  unit: p.unit,
  quantity: p.quantityAt,
});

export function PartsUsedPicker({ locationId, suggestions = [], onAdd, error, disabled, label = 'Add a part used' }: PartsUsedPickerProps) {
  const searchId = useId();
  const quantityId = useId();
  const [q, setQ] = useState('');
  const [picked, setPicked] = useState<PickedPart | null>(null);
  const [quantityText, setQuantityText] = useState('1');
  const [failure, setFailure] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const search = q.trim();
  const found = useParts({ q: search, limit: 8, ...(locationId ? { locationId } : {}) }, search.length > 0);
  const offered: PickedPart[] = search ? (found.data?.items ?? []).map(fromCatalogue) : [...suggestions];

  const quantity = picked ? readQuantity(quantityText, picked.unit) : null;
  const tooMany =
    picked && quantity?.ok && locationId && picked.quantity !== null && quantity.value > picked.quantity
      ? `only ${formatQuantity(picked.quantity, picked.unit)} on the van`
      : null;
  const problem = quantity && !quantity.ok ? quantity.message : tooMany;

  async function add() {
    if (!picked || !quantity?.ok || tooMany) return;
    setBusy(true);
    setFailure(null);
    try {
      await onAdd({ cataloguePartId: picked.cataloguePartId, quantity: quantity.value, part: picked });
      setPicked(null);
      setQuantityText('1');
      setQ('');
    } catch (err) {
      const fields = err instanceof ApiError ? err.fieldErrors() : {};
      setFailure(fields.quantity ? asSentence(fields.quantity) : err instanceof Error ? err.message : 'Could not add the part.');
    } finally {
      setBusy(false);
    }
  }

  return (
    <section className="grid gap-3 rounded-md border border-dashed border-ink-muted p-3" aria-label={label}>
      <h3 className="font-bold">{label}</h3>
      <div className="grid gap-1">
        <label htmlFor={searchId} className="font-semibold">
          Find a part
        </label>
        <div className="relative">
          <Search aria-hidden className="pointer-events-none absolute top-1/2 left-3 size-5 -translate-y-1/2 text-ink-muted" />
          <input
            id={searchId}
            type="search"
            className={`${inputClass} min-h-12 pl-10`}
            placeholder="Part number or description, e.g. fuse"
            value={q}
            disabled={disabled}
            onChange={(e) => setQ(e.target.value)}
          />
        </div>
      </div>
      {search && found.isLoading && (
        <p role="status" className="text-ink-muted">
          Searching…
        </p>
      )}
      {search && found.error && (
        <p role="alert" className="font-semibold text-down">
          Could not search the catalogue.
        </p>
      )}
      {offered.length === 0 && search && !found.isLoading && !found.error && <p className="text-ink-soft">No part matches “{search}”.</p>}
      {offered.length > 0 && (
        <ul className="grid gap-2" aria-label={search ? 'Matching parts' : 'Parts that fit'}>
          {offered.map((p) => {
            const selected = picked?.cataloguePartId === p.cataloguePartId;
            return (
              <li key={`${p.cataloguePartId}-${p.note ?? ''}`}>
                <button
                  type="button"
                  aria-pressed={selected}
                  disabled={disabled}
                  onClick={() => setPicked(selected ? null : p)}
                  className={`flex min-h-12 w-full items-center justify-between gap-3 rounded-md border px-3 py-2 text-left ${
                    selected ? 'border-ink bg-paper-dim ring-2 ring-ink' : 'border-paper-line bg-white'
                  }`}
                >
                  <span className="grid">
                    <span className="font-semibold">{p.partNumber}</span>
                    <span className="text-sm text-ink-soft">
                      {p.description}
                      {p.note ? ` · ${p.note}` : ''}
                    </span>
                  </span>
                  {p.quantity !== null && (
                    <span className="tabular text-sm font-semibold whitespace-nowrap">{formatQuantity(p.quantity, p.unit)} on the van</span>
                  )}
                </button>
              </li>
            );
          })}
        </ul>
      )}
      {picked && (
        <div className="flex flex-wrap items-end gap-2">
          <div className="grid gap-1">
            <label htmlFor={quantityId} className="font-semibold">
              How many {picked.unit === 'each' ? '' : `(${picked.unit})`}
            </label>
            <input
              id={quantityId}
              inputMode="decimal"
              className={`${inputClass} min-h-12 w-32`}
              value={quantityText}
              aria-invalid={!!problem}
              aria-describedby={problem ? `${quantityId}-problem` : undefined}
              onChange={(e) => setQuantityText(e.target.value)}
            />
          </div>
          <button type="button" className="btn-primary min-h-12" disabled={disabled || busy || !!problem} onClick={() => void add()}>
            <Plus aria-hidden className="size-5" /> Add {picked.partNumber}
          </button>
          {problem && (
            <p id={`${quantityId}-problem`} className="w-full text-sm font-semibold text-down">
              {asSentence(problem)}
            </p>
          )}
        </div>
      )}
      {(failure ?? error) && (
        <p role="alert" className="text-sm font-semibold text-down">
          {failure ?? error}
        </p>
      )}
    </section>
  );
}
