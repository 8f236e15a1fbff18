// Parts used on the job: picked off the board's parts list (designator and value) or written in, each with a
// whole-number quantity. The quantity's text is kept while it is not yet a whole number (the draft holds numbers).
import { useId, useState } from 'react';
import { Plus, Trash2 } from 'lucide-react';
import type { BenchJobDraft, BenchPartUsed } from '@bumperline/contracts/bench-vocabulary';
import { partKindLabels } from '@bumperline/contracts/bench-vocabulary';
import { inputClass } from '../../components/field.tsx';
import { useQuery } from '@tanstack/react-query';
import { boardPageQuery } from '../../api/boards.ts';
import { useBoardCatalogueFits } from '../../api/parts-catalogue.ts';
import type { JobPart } from './job-parts.ts';
import { setPartsUsed } from './draft.ts';
import { fieldDomId } from './field-problems.ts';

export function PartsUsedRecord({
  partsUsed,
  boardParts,
  stepParts,
  readOnly,
  problems,
  edit,
  boardInstanceId,
}: {
  /** The job's board: its parts-list entries' catalogue parts come off the finisher's van when the job is finished. */
  boardInstanceId?: string;
  partsUsed: readonly BenchPartUsed[];
  /** Every part on the board's parts list. */
  boardParts: readonly JobPart[];
  /** The parts this step concerns (a recap step: the electrolytics), offered first; empty = every part. */
  stepParts: readonly JobPart[];
  readOnly: boolean;
  problems: Readonly<Record<string, string>>;
  edit: (change: (draft: BenchJobDraft) => BenchJobDraft) => void;
}) {
  const pickId = useId();
  const [picked, setPicked] = useState('');
  const change = (list: BenchPartUsed[]) => edit((d) => setPartsUsed(d, list));
  const update = (i: number, value: Partial<BenchPartUsed>) => change(partsUsed.map((u, j) => (j === i ? { ...u, ...value } : u)));
  const selectable = (stepParts.length ? stepParts : boardParts).filter((p) => !p.line.removed);
  // The catalogue part linked to each entry (the first, when several fit), with how many are on the van: a line
  // added from the list names it only when the van holds one, so finishing takes it off the van; otherwise the part
  // came from elsewhere and no stock moves.
  const board = useQuery({ ...boardPageQuery(boardInstanceId ?? ''), enabled: !!boardInstanceId });
  const fits = useBoardCatalogueFits(boardInstanceId ? board.data?.instance.boardId : undefined);
  const fitOf = (boardPartId: string) => fits.data?.items.find((f) => f.boardPartId === boardPartId);

  return (
    <div className="grid gap-3">
      {partsUsed.length === 0 ? (
        <p className="text-ink-soft">No parts listed on this job yet.</p>
      ) : (
        <ul className="grid gap-2" aria-label="Parts used">
          {partsUsed.map((used, i) => (
            <PartUsedLine
              // Lines have no id of their own; the index is stable because lines are only added at the end or removed.
              key={i}
              index={i}
              used={used}
              readOnly={readOnly}
              problems={problems}
              onChange={(value) => update(i, value)}
              onRemove={() => change(partsUsed.filter((_, j) => j !== i))}
            />
          ))}
        </ul>
      )}
      {!readOnly && (
        <div className="grid gap-2 rounded-md border border-dashed border-ink-muted p-3">
          <label htmlFor={pickId} className="font-semibold">
            Add a part from the parts list
          </label>
          <div className="flex flex-wrap gap-2">
            <select
              id={pickId}
              className={`${inputClass} min-w-0 flex-[1_1_14rem]`}
              value={picked}
              onChange={(e) => setPicked(e.target.value)}
            >
              <option value="">Choose a part…</option>
              {selectable.map((p) => (
                <option key={p.id} value={p.id}>
                  {p.line.designator} — {p.line.value} ({partKindLabels[p.line.kind].toLowerCase()})
                </option>
              ))}
            </select>
            <button
              type="button"
              className="btn-primary"
              disabled={!picked}
              onClick={() => {
                const part = selectable.find((p) => p.id === picked);
                if (!part) return;
                const fit = fitOf(part.id);
                change([
                  ...partsUsed,
                  {
                    partId: part.id,
                    description: `${part.line.designator} ${part.line.value}`,
                    quantity: 1,
                    cataloguePartId: fit && (fit.vanQuantity ?? 0) >= 1 ? fit.cataloguePartId : null,
                  },
                ]);
                setPicked('');
              }}
            >
              <Plus aria-hidden className="size-4" /> Add
            </button>
          </div>
          <button
            type="button"
            className="btn-secondary justify-self-start"
            onClick={() => change([...partsUsed, { partId: null, description: '', quantity: 1 }])}
          >
            <Plus aria-hidden className="size-4" /> Add a part not on the list
          </button>
        </div>
      )}
    </div>
  );
}

function PartUsedLine({
  index,
  used,
  readOnly,
  problems,
  onChange,
  onRemove,
}: {
  index: number;
  used: BenchPartUsed;
  readOnly: boolean;
  problems: Readonly<Record<string, string>>;
  onChange: (value: Partial<BenchPartUsed>) => void;
  onRemove: () => void;
}) {
  const descriptionField = `partsUsed.${index}.description`;
  const quantityField = `partsUsed.${index}.quantity`;
  const descriptionId = fieldDomId(descriptionField);
  const quantityId = fieldDomId(quantityField);
  // Text that is not (yet) a whole number stays here; a valid quantity lives in the draft.
  const [unfinishedQuantity, setUnfinishedQuantity] = useState<string | null>(null);
  const quantityText = unfinishedQuantity ?? String(used.quantity);
  const wholeNumber = /^\s*\d+\s*$/.test(quantityText) && Number(quantityText) >= 1 && Number(quantityText) <= 999;
  const quantityProblem = wholeNumber ? problems[quantityField] : 'a whole number of parts, 1 to 999';
  const descriptionProblem = used.description.trim() ? undefined : problems[descriptionField];
  return (
    <li className="grid grid-cols-[1fr_auto] items-end gap-2 rounded-md border border-paper-line p-3 sm:grid-cols-[1fr_7rem_auto]">
      <div className="col-span-2 grid gap-1 sm:col-span-1">
        <label htmlFor={descriptionId} className="text-sm font-semibold">
          Part {index + 1}
          {used.partId ? ' (from the parts list)' : ''}
          {used.cataloguePartId ? ' — comes off your van when the job is finished' : ''}
        </label>
        <input
          id={descriptionId}
          className={inputClass}
          value={used.description}
          maxLength={200}
          placeholder={readOnly ? undefined : 'e.g. 4700µF 35V 105 °C electrolytic'}
          disabled={readOnly}
          aria-invalid={!!descriptionProblem}
          aria-describedby={descriptionProblem ? `${descriptionId}-problem` : undefined}
          onChange={(e) => onChange({ description: e.target.value })}
        />
        {descriptionProblem && (
          <p id={`${descriptionId}-problem`} className="text-sm font-semibold text-down">
            {descriptionProblem}
          </p>
        )}
      </div>
      <div className="grid gap-1">
        <label htmlFor={quantityId} className="text-sm font-semibold">
          Quantity
        </label>
        <input
          id={quantityId}
          className={`${inputClass} tabular`}
          inputMode="numeric"
          value={quantityText}
          disabled={readOnly}
          aria-invalid={!!quantityProblem}
          aria-describedby={quantityProblem ? `${quantityId}-problem` : undefined}
          onChange={(e) => {
            const text = e.target.value;
            if (/^\s*\d+\s*$/.test(text) && Number(text) >= 1 && Number(text) <= 999) {
              setUnfinishedQuantity(null);
              onChange({ quantity: Number(text) });
            } else setUnfinishedQuantity(text);
          }}
        />
      </div>
      {!readOnly && (
        <button type="button" className="btn-danger" onClick={onRemove} aria-label={`Remove part ${index + 1}`}>
          <Trash2 aria-hidden className="size-4" />
          <span className="sr-only sm:not-sr-only">Remove</span>
        </button>
      )}
      {quantityProblem && (
        <p id={`${quantityId}-problem`} className="col-span-full text-sm font-semibold text-down">
          Quantity: {quantityProblem}
        </p>
      )}
    </li>
  );
}
