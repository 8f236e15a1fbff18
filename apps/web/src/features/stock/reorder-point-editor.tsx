// A part's reorder point and how many to order, at one stock: edited in place by the office, at the level's
// version (a 409 says someone changed it meanwhile).
import { useState, type FormEvent } from 'react';
import type { StockLevel } from '@bumperline/contracts/stock';
import { useSetReorder } from '../../api/stock.ts';
import { inputClass } from '../../components/field.tsx';
import { ApiError } from '../../lib/api-client.ts';
import { asSentence } from '../../lib/format.ts';
import { readQuantity } from '../../lib/quantity-entry.ts';

export function ReorderPointEditor({ level, onDone }: { level: StockLevel; onDone: () => void }) {
  const save = useSetReorder(level.locationId);
  const [point, setPoint] = useState(level.reorderPoint === null ? '' : String(level.reorderPoint));
  const [amount, setAmount] = useState(level.reorderQuantity === null ? '' : String(level.reorderQuantity));
  const [error, setError] = useState<string | null>(null);

  async function submit(e: FormEvent) {
    e.preventDefault();
    const p = point.trim() ? readQuantity(point, level.unit, { allowZero: true }) : null;
    const a = amount.trim() ? readQuantity(amount, level.unit) : null;
    if (p && !p.ok) return setError(`Reorder point ${p.message}`);
    if (a && !a.ok) return setError(`Order quantity ${a.message}`);
    try {
      await save.mutateAsync({
        partId: level.cataloguePartId,
        reorderPoint: p?.ok ? p.value : null,
        reorderQuantity: a?.ok ? a.value : null,
        version: level.version,
      });
      onDone();
    } catch (err) {
      setError(
        err instanceof ApiError
          ? err.status === 409
            ? 'Someone changed this level meanwhile: close and try again.'
            : err.message
          : 'Could not save.',
      );
    }
  }

  return (
    <form className="flex flex-wrap items-end gap-2" onSubmit={(e) => void submit(e)} aria-label={`Reorder point of ${level.partNumber}`}>
      <label className="grid gap-1 text-sm font-semibold">
        Reorder at
        <input className={`${inputClass} w-24`} inputMode="decimal" value={point} onChange={(e) => setPoint(e.target.value)} />
      </label>
      <label className="grid gap-1 text-sm font-semibold">
        Order
        <input className={`${inputClass} w-24`} inputMode="decimal" value={amount} onChange={(e) => setAmount(e.target.value)} />
      </label>
      <button type="submit" className="btn-primary" disabled={save.isPending}>
        Save
      </button>
      <button type="button" className="btn-secondary" onClick={onDone}>
        Cancel
      </button>
      {error && <p className="w-full text-sm font-semibold text-down">{asSentence(error)}</p>}
    </form>
  );
}
