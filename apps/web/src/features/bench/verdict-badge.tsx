// A verdict in words, with its own shape and colour (never colour alone): pass, low, high, fail, accepted, refused.
import { CircleArrowDown, CircleArrowUp, CircleCheck, CircleHelp, OctagonX } from 'lucide-react';

export type VerdictWord = 'pass' | 'low' | 'high' | 'fail' | 'accepted' | 'refused' | 'indicative' | 'undersized' | 'ok';

const looks: Record<VerdictWord, { label: string; icon: typeof CircleCheck; tone: string }> = {
  pass: { label: 'PASS', icon: CircleCheck, tone: 'border-running bg-running-tint text-running' },
  ok: { label: 'OK', icon: CircleCheck, tone: 'border-running bg-running-tint text-running' },
  accepted: { label: 'ACCEPTED', icon: CircleCheck, tone: 'border-running bg-running-tint text-running' },
  low: { label: 'LOW', icon: CircleArrowDown, tone: 'border-down bg-down-tint text-down' },
  high: { label: 'HIGH', icon: CircleArrowUp, tone: 'border-down bg-down-tint text-down' },
  fail: { label: 'FAIL', icon: OctagonX, tone: 'border-down bg-down-tint text-down' },
  refused: { label: 'REFUSED', icon: OctagonX, tone: 'border-down bg-down-tint text-down' },
  undersized: { label: 'UNDERSIZED', icon: OctagonX, tone: 'border-down bg-down-tint text-down' },
  // A low reading in circuit may be parallel paths: attention, not a fail (the word “indicative” is said beside it).
  indicative: { label: 'LOW', icon: CircleHelp, tone: 'border-attention bg-attention-tint text-attention' },
};

export function VerdictBadge({ verdict, label }: { verdict: VerdictWord; label?: string }) {
  const look = looks[verdict];
  const Icon = look.icon;
  return (
    <span
      className={`inline-flex items-center gap-1 rounded-md border-2 px-2 py-0.5 text-sm font-extrabold tracking-wide whitespace-nowrap print:border-black print:bg-white print:text-black ${look.tone}`}
    >
      <Icon aria-hidden className="size-4" />
      {label ?? look.label}
    </span>
  );
}
