// A board's recap status: a word and an icon beside the colour, never colour alone.
import { CalendarClock, CircleCheck, CircleHelp, CircleMinus, OctagonExclamationPoint } from 'lucide-react';
import type { RecapEstimate, RecapStatus } from '@bumperline/contracts/boards';
import { asSentence, formatDate, type LocaleSettings } from '../lib/format.ts';

export const recapStatusLabels: Record<RecapStatus, string> = {
  overdue: 'Recap overdue',
  'due-soon': 'Recap due soon',
  ok: 'Recap not due',
  unknown: 'Date to settle',
  'no-electrolytics': 'Nothing to recap',
};

const styles: Record<RecapStatus, { className: string; Icon: typeof CircleCheck }> = {
  overdue: { className: 'bg-down-tint text-down', Icon: OctagonExclamationPoint },
  'due-soon': { className: 'bg-attention-tint text-attention', Icon: CalendarClock },
  ok: { className: 'bg-running-tint text-running', Icon: CircleCheck },
  unknown: { className: 'bg-shop-tint text-shop', Icon: CircleHelp },
  'no-electrolytics': { className: 'bg-paper-dim text-ink-soft', Icon: CircleMinus },
};

export function RecapStatusBadge({ status }: { status: RecapStatus }) {
  const { className, Icon } = styles[status];
  return (
    <span className={`inline-flex items-center gap-1 rounded-full px-2.5 py-0.5 text-sm font-semibold whitespace-nowrap ${className}`}>
      <Icon aria-hidden className="size-4" />
      {recapStatusLabels[status]}
    </span>
  );
}

/**
 * What to do about the board, in the company's date format: "Recap now: overdue since Dec 19, 1992 — C1 (85 °C,
 * 1,000 h) sets the date"; for a date code to settle, how to settle it. Null when there is nothing to do yet.
 */
export function recapAdvice(recap: RecapEstimate, locale: LocaleSettings | undefined): string | null {
  if (recap.status === 'overdue' && recap.dueDate) {
    const limiting = recap.limitingDesignator ? ` — ${recap.limitingDesignator} (${recap.limitingRating}) sets the date` : '';
    return `Recap now: overdue since ${formatDate(recap.dueDate, locale)}${limiting}`;
  }
  return recap.recommendation ? asSentence(recap.recommendation) : null;
}

/** One line on when the recap is due, in the company's date format. */
export function recapLine(recap: RecapEstimate, locale: LocaleSettings | undefined): string {
  const due = formatDate(recap.dueDate, locale);
  switch (recap.status) {
    case 'overdue':
      return `Overdue since ${due}`;
    case 'due-soon':
      return `Due ${due} (within ${recap.monthsUntilDue} month${recap.monthsUntilDue === 1 ? '' : 's'})`;
    case 'ok':
      return `Due ${due}`;
    default:
      return asSentence(recap.message);
  }
}
