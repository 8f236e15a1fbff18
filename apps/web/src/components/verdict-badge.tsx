// A verdict in words, with its own icon and colour (never colour alone): pass, low, high, fail, accepted, refused, …
// The same look on the bench job, the job sheet, the board's readings and the points of its charts.
import { CircleArrowDown, CircleArrowUp, CircleCheck, CircleHelp, OctagonX } from 'lucide-react';
import type { ReadingVerdictWord } from '@bumperline/contracts/bench-vocabulary';

export type VerdictWord = 'pass' | 'low' | 'high' | 'fail' | 'accepted' | 'refused' | 'indicative' | 'undersized' | 'ok';

const good = { text: 'text-running', box: 'border-running bg-running-tint' };
const bad = { text: 'text-down', box: 'border-down bg-down-tint' };

const looks: Record<VerdictWord, { label: string; icon: typeof CircleCheck; text: string; box: string }> = {
  pass: { label: 'PASS', icon: CircleCheck, ...good },
  ok: { label: 'OK', icon: CircleCheck, ...good },
  accepted: { label: 'ACCEPTED', icon: CircleCheck, ...good },
  low: { label: 'LOW', icon: CircleArrowDown, ...bad },
  high: { label: 'HIGH', icon: CircleArrowUp, ...bad },
  fail: { label: 'FAIL', icon: OctagonX, ...bad },
  refused: { label: 'REFUSED', icon: OctagonX, ...bad },
  undersized: { label: 'UNDERSIZED', icon: OctagonX, ...bad },
  // A low reading in circuit may be parallel paths: attention, not a fail.
  indicative: { label: 'LOW IN CIRCUIT', icon: CircleHelp, text: 'text-attention', box: 'border-attention bg-attention-tint' },
};

/** A reading's verdict word: a low reading taken in circuit is indicative, not low. */
export const verdictOfReading = (r: { verdict: ReadingVerdictWord; indicative: boolean }): VerdictWord =>
  r.indicative ? 'indicative' : r.verdict;

export function VerdictBadge({ verdict, label }: { verdict: VerdictWord; label?: string }) {
  const look = looks[verdict];
  const Icon = look.icon;
  return (
    <span
      className={`inline-flex items-center gap-1 rounded-md border-2 px-2 py-0.5 text-sm font-extrabold tracking-wide whitespace-nowrap print:border-black print:bg-white print:text-black ${look.box} ${look.text}`}
    >
      <Icon aria-hidden className="size-4" />
      {label ?? look.label}
    </span>
  );
}

/** The badge's icon alone, centred on (cx, cy) inside a chart's SVG, on a white disc so it stands off the line. */
export function VerdictIcon({ verdict, cx, cy, size = 14 }: { verdict: VerdictWord; cx: number; cy: number; size?: number }) {
  const look = looks[verdict];
  const Icon = look.icon;
  return (
    <g className={look.text}>
      <circle cx={cx} cy={cy} r={size / 2} fill="#fff" />
      <Icon aria-hidden x={cx - size / 2} y={cy - size / 2} width={size} height={size} strokeWidth={2.5} />
    </g>
  );
}
