// A stock quantity as typed ("3", "1.5", "2,5 m") read into a number, judged by the domain's rule for the part's unit
// (whole numbers for parts counted each) — the same rule the API applies, so the screen says it first.
import { checkStockQuantity, type StockUnitName } from '@bumperline/domain/stock/quantity-rules';
import { isDomainError } from '@bumperline/domain/errors';

export type QuantityEntry = { ok: true; value: number } | { ok: false; message: string };

export function readQuantity(text: string, unit: StockUnitName, opts: { allowZero?: boolean } = {}): QuantityEntry {
  // The unit may be typed after the number ("2.5 m", "3 each"); a decimal comma is read as a point.
  const t = text
    .trim()
    .replace(new RegExp(`\\s*${unit}$`, 'i'), '')
    .replace(',', '.');
  if (t === '') return { ok: false, message: 'Enter how many' };
  if (!/^-?\d*\.?\d+$/.test(t)) return { ok: false, message: 'is not a number' };
  const value = Number(t);
  try {
    checkStockQuantity(unit, value, 'quantity', opts.allowZero ?? false);
  } catch (err) {
    if (isDomainError(err)) return { ok: false, message: err.message };
    throw err;
  }
  return { ok: true, value };
}

/** A quantity with its unit, as the stock screens show it ("3", "2.5 m"). */
export function formatQuantity(value: number, unit: StockUnitName, locale = 'en-US'): string {
  const n = new Intl.NumberFormat(locale, { maximumFractionDigits: 3 }).format(value);
  return unit === 'each' ? n : `${n} ${unit}`;
}
