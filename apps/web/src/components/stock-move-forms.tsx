// The forms that move stock: receive from a supplier, transfer between stocks, count. Quantities are typed as
// people say them and checked with the same rule as the API (whole numbers for parts counted each); the API's
// refusal ("only 3 on the van") shows beside the field. Shared by the office's stock screen and the van screen.
import { useState, type FormEvent, type ReactNode } from 'react';
import { ArrowRightLeft, ClipboardCheck, PackagePlus } from 'lucide-react';
import type { CataloguePart } from '@bumperline/contracts/parts-catalogue';
import type { StockChange, StockLocation } from '@bumperline/contracts/stock';
import { useCountStock, useReceiveStock, useTransferStock } from '../api/stock.ts';
import { useLocaleSettings } from '../api/me.ts';
import { ApiError } from '../lib/api-client.ts';
import { asSentence, defaultLocale } from '../lib/format.ts';
import { readMoney } from '../lib/money-entry.ts';
import { formatQuantity, readQuantity } from '../lib/quantity-entry.ts';
import { CataloguePartSearch } from './catalogue-part-search.tsx';
import { Field, inputClass } from './field.tsx';

type Errors = Record<string, string>;

function problemsOf(err: unknown): { fields: Errors; banner: string | null } {
  if (!(err instanceof ApiError)) return { fields: {}, banner: 'Could not save. Try again.' };
  const fields = err.fieldErrors();
  return { fields, banner: Object.keys(fields).length ? null : err.message };
}

function FormShell({
  title,
  icon,
  onSubmit,
  busy,
  submitLabel,
  banner,
  done,
  children,
  large,
}: {
  title: string;
  icon: ReactNode;
  onSubmit: (e: FormEvent) => void;
  busy: boolean;
  submitLabel: string;
  banner: string | null;
  done: string | null;
  children: ReactNode;
  large?: boolean;
}) {
  return (
    <form className="card grid gap-3" onSubmit={onSubmit} noValidate aria-label={title}>
      <h3 className="flex items-center gap-2 text-lg font-bold">
        {icon}
        {title}
      </h3>
      {children}
      {banner && (
        <p role="alert" className="font-semibold text-down">
          {banner}
        </p>
      )}
      {done && (
        <p role="status" className="font-semibold text-running">
          {done}
        </p>
      )}
      <div>
        <button type="submit" className={`btn-primary ${large ? 'min-h-12 w-full text-lg' : ''}`} disabled={busy}>
          {busy ? 'Saving…' : submitLabel}
        </button>
      </div>
    </form>
  );
}

function QuantityField({ label, value, onChange, error }: { label: string; value: string; onChange: (v: string) => void; error?: string }) {
  return (
    <Field label={label} error={error ? asSentence(error) : undefined}>
      {(p) => (
        <input {...p} className={`${inputClass} min-h-12`} inputMode="decimal" value={value} onChange={(e) => onChange(e.target.value)} />
      )}
    </Field>
  );
}

/** Received from a supplier into `location`; the price paid defaults to the catalogue's. */
export function ReceiveForm({ location }: { location: StockLocation }) {
  const locale = useLocaleSettings() ?? defaultLocale;
  const receive = useReceiveStock();
  const [part, setPart] = useState<CataloguePart | null>(null);
  const [quantity, setQuantity] = useState('');
  const [price, setPrice] = useState('');
  const [errors, setErrors] = useState<Errors>({});
  const [banner, setBanner] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);

  async function submit(e: FormEvent) {
    e.preventDefault();
    setDone(null);
    setBanner(null);
    const local: Errors = {};
    if (!part) local.cataloguePartId = 'Choose a part';
    const q = part ? readQuantity(quantity, part.unit) : null;
    if (q && !q.ok) local.quantity = q.message;
    const money = price.trim() ? readMoney(price, locale) : null;
    if (money && !money.ok) local.unitCostCents = money.message;
    setErrors(local);
    if (Object.keys(local).length || !part || !q?.ok) return;
    try {
      const change = await receive.mutateAsync({
        cataloguePartId: part.id,
        locationId: location.id,
        quantity: q.value,
        ...(money?.ok ? { unitCostCents: money.cents } : {}),
      });
      setDone(
        `Received ${formatQuantity(q.value, part.unit)} of ${part.partNumber}: ${location.name} now holds ${formatQuantity(change.levels[0]?.quantity ?? 0, part.unit)}.`,
      );
      setQuantity('');
      setPrice('');
    } catch (err) {
      const p = problemsOf(err);
      setErrors(p.fields);
      setBanner(p.banner);
    }
  }

  return (
    <FormShell
      title={`Receive into ${location.name}`}
      icon={<PackagePlus aria-hidden className="size-5" />}
      onSubmit={(e) => void submit(e)}
      busy={receive.isPending}
      submitLabel="Receive"
      banner={banner}
      done={done}
    >
      <CataloguePartSearch value={part} onChange={setPart} error={errors.cataloguePartId} />
      <QuantityField label="How many" value={quantity} onChange={setQuantity} error={errors.quantity} />
      <Field
        label="Price paid each (optional)"
        hint="Leave empty for the catalogue’s cost"
        error={errors.unitCostCents && asSentence(errors.unitCostCents)}
      >
        {(p) => <input {...p} className={inputClass} inputMode="decimal" value={price} onChange={(e) => setPrice(e.target.value)} />}
      </Field>
    </FormShell>
  );
}

/**
 * Moves stock from one stock to another. `from`/`to` fixed when given (the van screen fixes `to` at the van);
 * otherwise chosen from `locations`.
 */
export function TransferForm({
  locations,
  from: fixedFrom,
  to: fixedTo,
  large,
  title = 'Transfer',
}: {
  locations: StockLocation[];
  from?: StockLocation;
  to?: StockLocation;
  large?: boolean;
  title?: string;
}) {
  const transfer = useTransferStock();
  const others = (exclude?: string) => locations.filter((l) => l.id !== exclude && !l.retiredAt);
  const [fromId, setFromId] = useState(fixedFrom?.id ?? others(fixedTo?.id)[0]?.id ?? '');
  const [toId, setToId] = useState(fixedTo?.id ?? others(fixedFrom?.id)[0]?.id ?? '');
  const [part, setPart] = useState<CataloguePart | null>(null);
  const [quantity, setQuantity] = useState('');
  const [errors, setErrors] = useState<Errors>({});
  const [banner, setBanner] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const name = (id: string) => locations.find((l) => l.id === id)?.name ?? 'the stock';

  async function submit(e: FormEvent) {
    e.preventDefault();
    setDone(null);
    setBanner(null);
    const local: Errors = {};
    if (!part) local.cataloguePartId = 'Choose a part';
    if (!fromId) local.fromLocationId = 'Choose where it comes from';
    if (!toId || toId === fromId) local.toLocationId = 'Choose another stock to move it to';
    const q = part ? readQuantity(quantity, part.unit) : null;
    if (q && !q.ok) local.quantity = q.message;
    if (part && q?.ok && part.quantityAt !== null && q.value > part.quantityAt) {
      local.quantity = `only ${formatQuantity(part.quantityAt, part.unit)} at ${name(fromId)}`;
    }
    setErrors(local);
    if (Object.keys(local).length || !part || !q?.ok) return;
    try {
      await transfer.mutateAsync({ cataloguePartId: part.id, fromLocationId: fromId, toLocationId: toId, quantity: q.value });
      setDone(`Moved ${formatQuantity(q.value, part.unit)} of ${part.partNumber} from ${name(fromId)} to ${name(toId)}.`);
      setQuantity('');
      setPart(null);
    } catch (err) {
      const p = problemsOf(err);
      setErrors(p.fields);
      setBanner(p.banner);
    }
  }

  const select = (label: string, value: string, set: (v: string) => void, exclude: string | undefined, error?: string) => (
    <Field label={label} error={error && asSentence(error)}>
      {(p) => (
        <select {...p} className={`${inputClass} min-h-12`} value={value} onChange={(e) => set(e.target.value)}>
          <option value="">Choose…</option>
          {others(exclude).map((l) => (
            <option key={l.id} value={l.id}>
              {l.name}
            </option>
          ))}
        </select>
      )}
    </Field>
  );

  return (
    <FormShell
      title={title}
      icon={<ArrowRightLeft aria-hidden className="size-5" />}
      onSubmit={(e) => void submit(e)}
      busy={transfer.isPending}
      submitLabel="Move it"
      banner={banner}
      done={done}
      large={large}
    >
      {fixedFrom ? <p>From {fixedFrom.name}</p> : select('From', fromId, setFromId, undefined, errors.fromLocationId)}
      {fixedTo ? <p>To {fixedTo.name}</p> : select('To', toId, setToId, fromId, errors.toLocationId)}
      <CataloguePartSearch value={part} onChange={setPart} locationId={fromId || undefined} error={errors.cataloguePartId} />
      <QuantityField label="How many" value={quantity} onChange={setQuantity} error={errors.quantity} />
    </FormShell>
  );
}

/** What the count found, in words: "Counted 3 — 1 fewer than the stock said (4)". */
export function countOutcome(change: StockChange): string {
  const m = change.movement;
  const diff = m.difference ?? 0;
  const said = formatQuantity(m.expectedQuantity ?? 0, m.unit);
  const counted = formatQuantity(m.countedQuantity ?? 0, m.unit);
  if (diff === 0) return `Counted ${counted} of ${m.partNumber} — the same as the stock said.`;
  const by = formatQuantity(Math.abs(diff), m.unit);
  return `Counted ${counted} of ${m.partNumber} — ${by} ${diff < 0 ? 'fewer' : 'more'} than the stock said (${said}).`;
}

/** A count of one part at `location`: the stock is set to it, and the difference is kept and shown. */
export function CountForm({ location, large }: { location: StockLocation; large?: boolean }) {
  const count = useCountStock();
  const [part, setPart] = useState<CataloguePart | null>(null);
  const [quantity, setQuantity] = useState('');
  const [errors, setErrors] = useState<Errors>({});
  const [banner, setBanner] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);

  async function submit(e: FormEvent) {
    e.preventDefault();
    setDone(null);
    setBanner(null);
    const local: Errors = {};
    if (!part) local.cataloguePartId = 'Choose a part';
    const q = part ? readQuantity(quantity, part.unit, { allowZero: true }) : null;
    if (q && !q.ok) local.countedQuantity = q.message;
    setErrors(local);
    if (Object.keys(local).length || !part || !q?.ok) return;
    try {
      setDone(countOutcome(await count.mutateAsync({ cataloguePartId: part.id, locationId: location.id, countedQuantity: q.value })));
      setQuantity('');
      setPart(null);
    } catch (err) {
      const p = problemsOf(err);
      setErrors(p.fields);
      setBanner(p.banner);
    }
  }

  return (
    <FormShell
      title={`Count ${location.name}`}
      icon={<ClipboardCheck aria-hidden className="size-5" />}
      onSubmit={(e) => void submit(e)}
      busy={count.isPending}
      submitLabel="Save the count"
      banner={banner}
      done={done}
      large={large}
    >
      <CataloguePartSearch value={part} onChange={setPart} locationId={location.id} error={errors.cataloguePartId} />
      <QuantityField label="Counted" value={quantity} onChange={setQuantity} error={errors.countedQuantity} />
    </FormShell>
  );
}
