// Adding or editing a catalogue part. The unit cost is typed as people say it ("$0.45", "12.50") and sent as
// cents; an edit carries the version it started from, and a 409 shows what changed meanwhile.
import { useState, type FormEvent } from 'react';
import type { CataloguePart } from '@bumperline/contracts/parts-catalogue';
import { partKindLabels, partKinds } from '@bumperline/contracts/bench-vocabulary';
import { stockUnitLabels, stockUnits } from '@bumperline/contracts/stock-vocabulary';
import type { PartKind } from '@bumperline/contracts/bench-vocabulary';
import type { StockUnit } from '@bumperline/contracts/stock-vocabulary';
import { useSavePart } from '../../api/parts-catalogue.ts';
import { useLocaleSettings } from '../../api/me.ts';
import { Field, inputClass } from '../../components/field.tsx';
import { ApiError } from '../../lib/api-client.ts';
import { asSentence, defaultLocale } from '../../lib/format.ts';
import { moneyInputText, readMoney } from '../../lib/money-entry.ts';

interface Draft {
  partNumber: string;
  description: string;
  kind: PartKind;
  unit: StockUnit;
  cost: string;
  supplier: string;
  notes: string;
}

export function PartForm({ part, onDone }: { part?: CataloguePart; onDone: (saved: CataloguePart) => void }) {
  const locale = useLocaleSettings() ?? defaultLocale;
  const save = useSavePart(part?.id);
  const [d, setD] = useState<Draft>(() => ({
    partNumber: part?.partNumber ?? '',
    description: part?.description ?? '',
    kind: part?.kind ?? 'fuse',
    unit: part?.unit ?? 'each',
    cost: part ? moneyInputText(part.unitCostCents, locale) : '',
    supplier: part?.supplier ?? '',
    notes: part?.notes ?? '',
  }));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [banner, setBanner] = useState<string | null>(null);
  const set = <K extends keyof Draft>(k: K, v: Draft[K]) => setD((prev) => ({ ...prev, [k]: v }));

  async function submit(e: FormEvent) {
    e.preventDefault();
    setBanner(null);
    const money = readMoney(d.cost, locale);
    const local: Record<string, string> = {};
    if (!d.partNumber.trim()) local.partNumber = 'is required';
    if (!d.description.trim()) local.description = 'is required';
    if (!money.ok) local.unitCostCents = money.message;
    setErrors(local);
    if (Object.keys(local).length || !money.ok) return;
    const body = {
      partNumber: d.partNumber.trim(),
      description: d.description.trim(),
      kind: d.kind,
      unit: d.unit,
      unitCostCents: money.cents,
      supplier: d.supplier.trim(),
      notes: d.notes.trim(),
    };
    try {
      onDone(await save.mutateAsync(part ? { ...body, version: part.version } : body));
    } catch (err) {
      if (!(err instanceof ApiError)) return setBanner('Could not save. Try again.');
      setErrors(err.fieldErrors());
      setBanner(
        err.status === 409
          ? 'Someone else changed this part since you opened it. Reload it to see their change, then edit again.'
          : err.message,
      );
    }
  }

  const msg = (k: string) => (errors[k] ? asSentence(errors[k]) : undefined);
  return (
    <form className="card grid gap-4 md:grid-cols-2" onSubmit={(e) => void submit(e)} noValidate>
      <Field label="Part number" error={msg('partNumber')}>
        {(p) => (
          <input {...p} className={inputClass} value={d.partNumber} onChange={(e) => set('partNumber', e.target.value)} maxLength={60} />
        )}
      </Field>
      <Field label="Description" error={msg('description')}>
        {(p) => (
          <input {...p} className={inputClass} value={d.description} onChange={(e) => set('description', e.target.value)} maxLength={200} />
        )}
      </Field>
      <Field label="Kind" error={msg('kind')}>
        {(p) => (
          <select {...p} className={inputClass} value={d.kind} onChange={(e) => set('kind', e.target.value as PartKind)}>
            {partKinds.map((k) => (
              <option key={k} value={k}>
                {partKindLabels[k]}
              </option>
            ))}
          </select>
        )}
      </Field>
      <Field label="Counted in" hint="Each: whole parts. Metres, grams, millilitres: up to three decimals." error={msg('unit')}>
        {(p) => (
          <select {...p} className={inputClass} value={d.unit} onChange={(e) => set('unit', e.target.value as StockUnit)}>
            {stockUnits.map((u) => (
              <option key={u} value={u}>
                {stockUnitLabels[u]}
              </option>
            ))}
          </select>
        )}
      </Field>
      <Field label="Unit cost" hint="As you would say it, e.g. $0.45 or 12.50" error={msg('unitCostCents')}>
        {(p) => <input {...p} className={inputClass} inputMode="decimal" value={d.cost} onChange={(e) => set('cost', e.target.value)} />}
      </Field>
      <Field label="Supplier" error={msg('supplier')}>
        {(p) => (
          <input {...p} className={inputClass} value={d.supplier} onChange={(e) => set('supplier', e.target.value)} maxLength={120} />
        )}
      </Field>
      <div className="md:col-span-2">
        <Field label="Notes" error={msg('notes')}>
          {(p) => <textarea {...p} className={inputClass} rows={2} value={d.notes} onChange={(e) => set('notes', e.target.value)} />}
        </Field>
      </div>
      {banner && (
        <p role="alert" className="font-semibold text-down md:col-span-2">
          {banner}
        </p>
      )}
      <div className="md:col-span-2">
        <button type="submit" className="btn-primary" disabled={save.isPending}>
          {save.isPending ? 'Saving…' : part ? 'Save part' : 'Add part'}
        </button>
      </div>
    </form>
  );
}
