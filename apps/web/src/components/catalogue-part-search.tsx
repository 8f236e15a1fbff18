// Choosing a catalogue part in a form: type part of its number or description, pick from what matches. With
// `locationId`, each choice shows how many that stock holds.
import { useId, useState } from 'react';
import type { CataloguePart } from '@bumperline/contracts/parts-catalogue';
import { useParts } from '../api/parts-catalogue.ts';
import { formatQuantity } from '../lib/quantity-entry.ts';
import { inputClass } from './field.tsx';

export function CataloguePartSearch({
  value,
  onChange,
  locationId,
  error,
  label = 'Part',
}: {
  value: CataloguePart | null;
  onChange: (part: CataloguePart | null) => void;
  locationId?: string;
  error?: string;
  label?: string;
}) {
  const searchId = useId();
  const pickId = useId();
  const [q, setQ] = useState('');
  const found = useParts({ q: q.trim() || undefined, limit: 20, ...(locationId ? { locationId } : {}) });
  const items = found.data?.items ?? [];
  // Keep the chosen part in the list while the search moves on.
  const options = value && !items.some((p) => p.id === value.id) ? [value, ...items] : items;
  return (
    <div className="grid gap-1">
      <label htmlFor={searchId} className="font-semibold">
        {label}: search
      </label>
      <input
        id={searchId}
        type="search"
        className={inputClass}
        placeholder="Part number or description"
        value={q}
        onChange={(e) => setQ(e.target.value)}
      />
      <label htmlFor={pickId} className="sr-only">
        {label}
      </label>
      <select
        id={pickId}
        className={inputClass}
        value={value?.id ?? ''}
        aria-invalid={!!error}
        onChange={(e) => onChange(options.find((p) => p.id === e.target.value) ?? null)}
      >
        <option value="">{found.isLoading ? 'Searching…' : options.length ? 'Choose a part…' : 'No part matches'}</option>
        {options.map((p) => (
          <option key={p.id} value={p.id}>
            {p.partNumber} — {p.description}
            {p.quantityAt !== null ? ` (${formatQuantity(p.quantityAt, p.unit)} here)` : ''}
          </option>
        ))}
      </select>
      {error && <p className="text-sm font-semibold text-down">{error}</p>}
    </div>
  );
}
