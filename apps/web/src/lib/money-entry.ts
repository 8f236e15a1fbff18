// Money as people type it ("$0.45", "12.50", "1,200", "12,50 €" in a decimal-comma locale) read into whole cents of
// the company's currency. The locale says which mark is the decimal one; a group mark is accepted only in groups of
// three, so "1,5" in en-US is refused rather than read as 15. Cents are what the API takes.
import { defaultLocale, type LocaleSettings } from './format.ts';

export type MoneyEntry = { ok: true; cents: number } | { ok: false; message: string };

function separators(locale: string): { decimal: string; group: string } {
  const parts = new Intl.NumberFormat(locale).formatToParts(12345.6);
  return {
    decimal: parts.find((p) => p.type === 'decimal')?.value ?? '.',
    group: parts.find((p) => p.type === 'group')?.value ?? ',',
  };
}

/** Minor units of the currency (2 for USD and EUR, 0 for JPY), from the platform's currency data. */
function fractionDigits(s: LocaleSettings): number {
  return new Intl.NumberFormat(s.locale, { style: 'currency', currency: s.currency }).resolvedOptions().maximumFractionDigits ?? 2;
}

const MAX_CENTS = 2_147_483_647;

export function readMoney(text: string, s: LocaleSettings = defaultLocale): MoneyEntry {
  const { decimal, group } = separators(s.locale);
  const digits = fractionDigits(s);
  // Currency symbols and codes, and spaces (a narrow no-break space groups digits in some locales), are dropped.
  let t = text
    .trim()
    .replace(new RegExp(`\\b${s.currency}\\b`, 'gi'), '')
    .replace(/[\p{Sc}\s\u00a0\u202f]/gu, '');
  if (t === '') return { ok: false, message: 'Enter an amount, like 12.50' };
  if (t.startsWith('-')) return { ok: false, message: 'must not be negative' };
  // A group mark that is a space was already dropped with the spaces.
  const groupMark = /\s/.test(group) ? null : group;
  const [whole = '', fraction, extra] = t.split(decimal);
  if (extra !== undefined) return { ok: false, message: `has more than one ${decimal}` };
  let wholeDigits = whole;
  if (groupMark && whole.includes(groupMark)) {
    const groups = whole.split(groupMark);
    if (!/^\d{1,3}$/.test(groups[0]!) || groups.slice(1).some((g) => !/^\d{3}$/.test(g))) {
      return { ok: false, message: `is not an amount: use ${decimal} for the cents` };
    }
    wholeDigits = groups.join('');
  }
  t = wholeDigits;
  if (!/^\d*$/.test(t) || (fraction !== undefined && !/^\d*$/.test(fraction)) || (t === '' && !fraction)) {
    return { ok: false, message: 'is not an amount' };
  }
  const frac = fraction ?? '';
  if (frac.length > digits) {
    return {
      ok: false,
      message: digits === 0 ? 'takes no fraction in this currency' : `has more than ${digits} digits after the ${decimal}`,
    };
  }
  const cents = Number(t || '0') * 10 ** digits + Number(frac.padEnd(digits, '0') || '0');
  if (!Number.isSafeInteger(cents) || cents > MAX_CENTS) return { ok: false, message: 'is too large' };
  return { ok: true, cents };
}

/** Cents as a person would type them back in the field ("12.50"), without the currency sign. */
export function moneyInputText(cents: number, s: LocaleSettings = defaultLocale): string {
  const digits = fractionDigits(s);
  return new Intl.NumberFormat(s.locale, { minimumFractionDigits: digits, maximumFractionDigits: digits, useGrouping: false }).format(
    cents / 10 ** digits,
  );
}
