// Parts fitted on a call or a work order, taken off the technician's van: picked with the shared picker, queued (so
// it works offline), and listed with the ones not sent yet.
import { Package, Plus } from 'lucide-react';
import { usePendingChanges, useEnqueueChange } from '../../api/technician-changes.ts';
import { useQuery } from '@tanstack/react-query';
import { myVanQuery } from '../../api/stock.ts';
import { PartsUsedPicker, type PickedPart } from '../../components/parts-used-picker.tsx';

export function PartsUsedSection({ on, id, title, where }: { on: 'call' | 'work-order'; id: string; title: string; where: string }) {
  const enqueue = useEnqueueChange();
  // What the van holds is offered before any search, from the phone's copy: picking works without signal (the
  // picker's catalogue search needs it).
  const van = useQuery(myVanQuery());
  const pending = usePendingChanges().map((p) => p.change);
  // The van as it will be once the queued parts have gone: a part queued offline is already off the van.
  const queuedOff = new Map<string, number>();
  for (const c of pending)
    if (c.kind === 'parts-used') queuedOff.set(c.cataloguePartId, (queuedOff.get(c.cataloguePartId) ?? 0) + c.quantity);
  const onVan: PickedPart[] = (van.data?.levels ?? [])
    .map((l) => ({ ...l, quantity: l.quantity - (queuedOff.get(l.cataloguePartId) ?? 0) }))
    .filter((l) => l.quantity > 0)
    .map((l) => ({
      cataloguePartId: l.cataloguePartId,
      partNumber: l.partNumber,
      description: l.description,
      unit: l.unit,
      quantity: l.quantity,
    }));
  const queued = pending.filter((c) => c.kind === 'parts-used' && c.on === on && c.id === id);
  return (
    <section className="grid gap-2" aria-label={`Parts used on ${title}`}>
      <h5 className="font-semibold text-ink">Parts used</h5>
      {queued.length > 0 && (
        <ul className="grid gap-1">
          {queued.map((c) => (
            <li key={c.key} className="flex items-center gap-2 text-ink">
              <Package aria-hidden className="size-4 shrink-0" /> {c.label.what}{' '}
              <span className="text-sm text-attention">(not sent yet)</span>
            </li>
          ))}
        </ul>
      )}
      <details className="rounded-md">
        <summary className="flex min-h-12 cursor-pointer items-center gap-2 font-bold text-ink">
          <Plus aria-hidden className="size-5 shrink-0" />
          Add a part used{van.data ? ` (${onVan.length} kinds on your van)` : ''}
        </summary>
        <PartsUsedPicker
          label="Parts on your van"
          locationId={van.data?.location?.id ?? null}
          suggestions={onVan}
          onAdd={({ part, quantity }) => {
            enqueue({
              kind: 'parts-used',
              on,
              id,
              cataloguePartId: part.cataloguePartId,
              quantity,
              label: { what: `Part used: ${quantity} × ${part.partNumber} ${part.description} on ${title}`, where },
            });
          }}
        />
      </details>
    </section>
  );
}
