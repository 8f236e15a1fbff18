// One part's readings over the years as a small chart: the tolerance window as a band, each reading a point whose
// icon and colour say its verdict (the verdict badge's own icon). Loaded on demand (recharts is large), so the board's page
// shows its facts first. The same numbers are in a table beside it for screen readers and for reading exactly.
import { CartesianGrid, Line, LineChart, ReferenceArea, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import type { PartReadingPoint } from '@bumperline/contracts/boards';
import { formatReadingValue } from './reading-format.ts';
import { VerdictBadge, VerdictIcon, verdictOfReading, type VerdictWord } from '../../components/verdict-badge.tsx';

const YEAR_MS = 365.25 * 86_400_000;

interface Point {
  t: number;
  v: number;
  verdict: VerdictWord;
  reading: PartReadingPoint;
}

function DotFor(props: { cx?: number; cy?: number; payload?: Point; index?: number }) {
  const { cx, cy, payload } = props;
  if (cx === undefined || cy === undefined || !payload) return <g key={props.index} />;
  return <VerdictIcon key={props.index} verdict={payload.verdict} cx={cx} cy={cy} />;
}

function TipContent({ active, payload, unit }: { active?: boolean; payload?: readonly { payload?: Point }[]; unit: string | null }) {
  const point = active ? payload?.[0]?.payload : undefined;
  if (!point) return null;
  return (
    <div className="rounded-md border border-paper-line bg-white px-2 py-1 text-sm shadow">
      <div>{new Date(point.t).toISOString().slice(0, 10)}</div>
      <div className="font-semibold tabular">{formatReadingValue(point.v, unit)}</div>
      <VerdictBadge verdict={point.verdict} />
    </div>
  );
}

export default function ReadingChart({ readings, designator }: { readings: PartReadingPoint[]; designator: string }) {
  const points: Point[] = readings
    .filter((r) => r.measured !== null)
    .map((r) => ({ t: Date.parse(r.takenAt), v: r.measured!, verdict: verdictOfReading(r), reading: r }));
  if (points.length === 0) return null;
  const latest = points[points.length - 1]!.reading;
  const unit = latest.unit;
  const min = latest.min;
  const max = latest.max;

  // Room around the readings and the window so neither sits on the frame.
  const values = [...points.map((p) => p.v), ...(min !== null && max !== null ? [min, max] : [])];
  const lo = Math.min(...values);
  const hi = Math.max(...values);
  const pad = (hi - lo || Math.abs(hi) || 1) * 0.15;
  const first = points[0]!.t;
  const last = points[points.length - 1]!.t;
  const span = Math.max(last - first, YEAR_MS);
  const verdicts = [...new Set(points.map((p) => p.verdict))];
  // The axis names the window's edges (the numbers that matter) and any reading outside them.
  const ticks =
    min !== null && max !== null
      ? [...new Set([min, max, ...points.map((p) => p.v).filter((v) => v < min || v > max)])].sort((x, y) => x - y)
      : undefined;
  const years = `${new Date(first).getUTCFullYear()}${last - first > YEAR_MS / 2 ? `–${new Date(last).getUTCFullYear()}` : ''}`;

  return (
    <figure className="m-0">
      <div
        role="img"
        aria-label={`${designator}: ${points.length} reading${points.length === 1 ? '' : 's'}, ${years}; latest ${formatReadingValue(points[points.length - 1]!.v, unit)}`}
        className="h-36 w-full"
      >
        <ResponsiveContainer width="100%" height="100%">
          <LineChart data={points} margin={{ top: 8, right: 16, bottom: 0, left: 0 }} accessibilityLayer={false}>
            <CartesianGrid stroke="#e2e7ef" strokeDasharray="3 3" />
            <XAxis
              dataKey="t"
              type="number"
              scale="time"
              domain={[first - span * 0.08, last + span * 0.08]}
              tickFormatter={(t: number) => String(new Date(t).getUTCFullYear())}
              tick={{ fontSize: 12, fill: '#475569' }}
              tickCount={4}
              allowDecimals={false}
            />
            <YAxis
              type="number"
              domain={[lo - pad, hi + pad]}
              tickFormatter={(v: number) => formatReadingValue(v, unit)}
              tick={{ fontSize: 12, fill: '#475569' }}
              width={72}
              {...(ticks ? { ticks } : { tickCount: 4 })}
            />
            {min !== null && max !== null && (
              <ReferenceArea
                y1={min}
                y2={max}
                fill="#e3f4ea"
                fillOpacity={0.9}
                stroke="#11643a"
                strokeDasharray="4 3"
                strokeOpacity={0.6}
              />
            )}
            <Tooltip content={(p) => <TipContent active={p.active} payload={p.payload as readonly { payload?: Point }[]} unit={unit} />} />
            <Line dataKey="v" stroke="#475569" strokeWidth={1.5} dot={DotFor} activeDot={false} isAnimationActive={false} />
          </LineChart>
        </ResponsiveContainer>
      </div>
      <figcaption className="mt-1 flex flex-wrap items-center gap-x-3 gap-y-1 text-xs text-ink-soft">
        {min !== null && max !== null && (
          <span className="inline-flex items-center gap-1">
            <span aria-hidden className="inline-block h-3 w-5 border border-dashed border-running bg-running-tint" />
            allowed {formatReadingValue(min, unit)} – {formatReadingValue(max, unit)}
          </span>
        )}
        {verdicts.map((verdict) => (
          <VerdictBadge key={verdict} verdict={verdict} />
        ))}
      </figcaption>
    </figure>
  );
}
