// A reading's verdict as a shape and a word, the same on the chart and in the tables: never colour alone.
// pass ● circle, low ▼ triangle down, high ▲ triangle up, fail ✕ cross; a low reading taken in circuit (maybe
// parallel paths) is a hollow ▽.
import type { PartReadingPoint } from '@bumperline/contracts/boards';

export type VerdictLook = 'pass' | 'low' | 'high' | 'fail' | 'indicative';

export const verdictColours: Record<VerdictLook, string> = {
  pass: '#11643a',
  low: '#a3161a',
  high: '#a3161a',
  fail: '#a3161a',
  indicative: '#8a4b00',
};

export const verdictWords: Record<VerdictLook, string> = {
  pass: 'Pass',
  low: 'Low',
  high: 'High',
  fail: 'Fail',
  indicative: 'Low in circuit (confirm out of circuit)',
};

export const lookOf = (r: Pick<PartReadingPoint, 'verdict' | 'indicative'>): VerdictLook => (r.indicative ? 'indicative' : r.verdict);

/** The shape alone, centred on (cx, cy): drawn inside the chart's SVG and inside the small icon below. */
export function VerdictShape({ look, cx, cy, size = 5 }: { look: VerdictLook; cx: number; cy: number; size?: number }) {
  const colour = verdictColours[look];
  const s = size;
  switch (look) {
    case 'pass':
      return <circle cx={cx} cy={cy} r={s} fill={colour} stroke="#fff" strokeWidth={1.5} />;
    case 'high':
      return (
        <polygon
          points={`${cx},${cy - s - 1} ${cx + s + 1},${cy + s} ${cx - s - 1},${cy + s}`}
          fill={colour}
          stroke="#fff"
          strokeWidth={1.5}
        />
      );
    case 'low':
      return (
        <polygon
          points={`${cx - s - 1},${cy - s} ${cx + s + 1},${cy - s} ${cx},${cy + s + 1}`}
          fill={colour}
          stroke="#fff"
          strokeWidth={1.5}
        />
      );
    case 'indicative':
      return (
        <polygon
          points={`${cx - s - 1},${cy - s} ${cx + s + 1},${cy - s} ${cx},${cy + s + 1}`}
          fill="#fff"
          stroke={colour}
          strokeWidth={2}
        />
      );
    case 'fail':
      return (
        <g stroke={colour} strokeWidth={2.5} strokeLinecap="round">
          <line x1={cx - s} y1={cy - s} x2={cx + s} y2={cy + s} />
          <line x1={cx - s} y1={cy + s} x2={cx + s} y2={cy - s} />
        </g>
      );
  }
}

/** The shape and the word, for tables and the legend. */
export function VerdictMark({ look, short = false }: { look: VerdictLook; short?: boolean }) {
  return (
    <span className="inline-flex items-center gap-1 font-semibold whitespace-nowrap" style={{ color: verdictColours[look] }}>
      <svg aria-hidden width="14" height="14" viewBox="0 0 14 14" className="shrink-0">
        <VerdictShape look={look} cx={7} cy={7} size={4.5} />
      </svg>
      {short && look === 'indicative' ? 'Low in circuit' : verdictWords[look]}
    </span>
  );
}
