// The usual cautions before opening a cabinet or a power supply on site: mains and charged filter capacitors. A
// reminder, not training — local codes and licensed practice rule (bench-cautions.ts says the same on the bench).
import { ShieldAlert } from 'lucide-react';
import { cautions, cautionsDeferral } from '@bumperline/contracts/bench-cautions';

export function SafetyNote() {
  return (
    <details className="rounded-md border-2 border-attention bg-attention-tint px-3 py-2 text-ink">
      <summary className="flex min-h-11 cursor-pointer items-center gap-2 font-bold text-attention">
        <ShieldAlert aria-hidden className="size-5 shrink-0" /> Safety before opening the cabinet
      </summary>
      <ul className="mt-2 grid gap-2">
        {[cautions.mains, cautions.charged_capacitors].map((c) => (
          <li key={c.title}>
            <strong>{c.title}.</strong> {c.text}
          </li>
        ))}
      </ul>
      <p className="mt-2 text-sm font-semibold">{cautionsDeferral}</p>
    </details>
  );
}
