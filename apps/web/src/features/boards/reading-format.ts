// A reading's value as the trade writes it ("570 Ω", "4.63 kΩ"), from the number and unit the API stores; the
// bench's own formatters (domain/components/bench-judgement.ts) for windows and deviations.
import { formatDeviation as formatPercent } from '@bumperline/domain/components/bench-judgement';
import { formatQuantity, UNITS, type Unit } from '@bumperline/domain/components/values';

export function formatReadingValue(value: number, unit: string | null): string {
  const u = UNITS.includes(unit as Unit) ? (unit as Unit) : null;
  return formatQuantity(value, u, { significantDigits: 4 });
}

/** "−5.0 %", or '' when the reading has no deviation (a diode set). */
export const formatDeviation = (percent: number | null): string => (percent === null ? '' : formatPercent(percent));
