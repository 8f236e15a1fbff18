// The company's stocks: warehouses and vans, how many parts each holds and how many are low, and adding one.
import { useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { Plus, Truck, Warehouse, X } from 'lucide-react';
import type { StockLocation } from '@bumperline/contracts/stock';
import { useTechnicians } from '../../api/calls.ts';
import { useAddStockLocation, useStockLocations } from '../../api/stock.ts';
import { useCan } from '../../api/use-can.ts';
import { Field, inputClass } from '../../components/field.tsx';
import { PageHeader } from '../../components/page-header.tsx';
import { Empty, ErrorState, Loading } from '../../components/states.tsx';
import { ApiError } from '../../lib/api-client.ts';
import { asSentence } from '../../lib/format.ts';
import { paths } from '../../lib/paths.ts';

function LocationCard({ l }: { l: StockLocation }) {
  const Icon = l.kind === 'van' ? Truck : Warehouse;
  return (
    <li className="card flex items-start gap-3">
      <Icon aria-hidden className="mt-1 size-6 text-ink-soft" />
      <div className="grid gap-1">
        <Link className="link text-lg" to={paths.stockLocation(l.id)}>
          {l.name}
        </Link>
        <span className="text-sm text-ink-soft">
          {l.kind === 'van' ? `Van${l.technicianName ? ` of ${l.technicianName}` : ''}` : 'Warehouse'}
        </span>
        <span className="tabular">
          {l.partCount} {l.partCount === 1 ? 'part' : 'parts'} held
          {l.lowCount > 0 && <span className="ml-2 font-semibold text-attention">· {l.lowCount} low</span>}
        </span>
      </div>
    </li>
  );
}

function AddLocationForm({ onDone }: { onDone: () => void }) {
  const add = useAddStockLocation();
  const technicians = useTechnicians(true);
  const [kind, setKind] = useState<'warehouse' | 'van'>('warehouse');
  const [name, setName] = useState('');
  const [technicianId, setTechnicianId] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});

  async function submit(e: FormEvent) {
    e.preventDefault();
    try {
      await add.mutateAsync(
        kind === 'van' ? { kind, name: name.trim(), technicianId: technicianId || undefined } : { kind, name: name.trim() },
      );
      onDone();
    } catch (err) {
      setErrors(err instanceof ApiError ? err.fieldErrors() : { name: 'could not be saved' });
    }
  }
  const msg = (k: string) => (errors[k] ? asSentence(errors[k]) : undefined);
  return (
    <form className="card mb-5 grid gap-4 md:grid-cols-3 md:items-end" onSubmit={(e) => void submit(e)} noValidate>
      <Field label="Kind">
        {(p) => (
          <select {...p} className={inputClass} value={kind} onChange={(e) => setKind(e.target.value as 'warehouse' | 'van')}>
            <option value="warehouse">Warehouse or shelves</option>
            <option value="van">A technician’s van</option>
          </select>
        )}
      </Field>
      {kind === 'van' && (
        <Field label="Technician" error={msg('technicianId')}>
          {(p) => (
            <select {...p} className={inputClass} value={technicianId} onChange={(e) => setTechnicianId(e.target.value)}>
              <option value="">Choose…</option>
              {(technicians.data?.items ?? []).map((t) => (
                <option key={t.userId} value={t.userId}>
                  {t.name}
                </option>
              ))}
            </select>
          )}
        </Field>
      )}
      <Field label={kind === 'van' ? 'Name (optional)' : 'Name'} error={msg('name')}>
        {(p) => <input {...p} className={inputClass} value={name} maxLength={80} onChange={(e) => setName(e.target.value)} />}
      </Field>
      <div>
        <button type="submit" className="btn-primary" disabled={add.isPending}>
          Add stock
        </button>
      </div>
    </form>
  );
}

export function StockPage() {
  const locations = useStockLocations();
  const canManage = useCan('stock:manage');
  const [adding, setAdding] = useState(false);
  const items = locations.data?.items ?? [];
  return (
    <>
      <PageHeader
        title="Stock"
        subtitle="Your warehouses and vans, and what each holds."
        actions={
          <>
            <Link to={paths.parts} className="btn-secondary">
              Parts catalogue
            </Link>
            {canManage && (
              <Link to={paths.reorder} className="btn-secondary">
                What to order
              </Link>
            )}
            {canManage && (
              <button type="button" className="btn-primary" onClick={() => setAdding(!adding)} aria-expanded={adding}>
                {adding ? <X aria-hidden className="size-4" /> : <Plus aria-hidden className="size-4" />} {adding ? 'Close' : 'Add stock'}
              </button>
            )}
          </>
        }
      />
      {adding && <AddLocationForm onDone={() => setAdding(false)} />}
      {locations.isLoading ? (
        <Loading />
      ) : locations.error ? (
        <ErrorState error={locations.error} onRetry={() => void locations.refetch()} />
      ) : items.length === 0 ? (
        <Empty title="No stocks yet.">{canManage && <p>Add your shop’s shelves first, then a van for each technician.</p>}</Empty>
      ) : (
        <ul className="grid gap-3 md:grid-cols-2 xl:grid-cols-3" aria-label="Stocks">
          {items.map((l) => (
            <LocationCard key={l.id} l={l} />
          ))}
        </ul>
      )}
    </>
  );
}
