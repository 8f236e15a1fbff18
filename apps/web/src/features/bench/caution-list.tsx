// A step's cautions in full, with the line that defers to local codes: on the job, the template and the sheet.
import { TriangleAlert } from 'lucide-react';
import type { CautionKind } from '@bumperline/contracts/bench-vocabulary';
import { cautions, cautionsDeferral } from '@bumperline/contracts/bench-cautions';

export function CautionList({ kinds, headingLevel = 3 }: { kinds: readonly CautionKind[]; headingLevel?: 3 | 4 }) {
  if (!kinds.length) return null;
  const Heading = headingLevel === 3 ? 'h3' : 'h4';
  return (
    <div className="grid gap-2 rounded-md border-2 border-attention bg-attention-tint p-3 print:border-black print:bg-white">
      <ul className="grid gap-3">
        {kinds.map((kind) => (
          <li key={kind} className="grid gap-1">
            <Heading className="flex items-center gap-2 font-bold text-attention print:text-black">
              <TriangleAlert aria-hidden className="size-5 shrink-0" />
              Caution: {cautions[kind].title}
            </Heading>
            <p className="text-ink">{cautions[kind].text}</p>
          </li>
        ))}
      </ul>
      <p className="text-sm font-semibold text-ink-soft print:text-black">{cautionsDeferral}</p>
    </div>
  );
}
