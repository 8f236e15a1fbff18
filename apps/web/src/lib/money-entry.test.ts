import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { moneyInputText, readMoney } from './money-entry.ts';

const usd = { locale: 'en-US', timeZone: 'America/Chicago', currency: 'USD' };
const eur = { locale: 'de-DE', timeZone: 'Europe/Berlin', currency: 'EUR' };
const jpy = { locale: 'ja-JP', timeZone: 'Asia/Tokyo', currency: 'JPY' };

describe('readMoney', () => {
  it('reads amounts as people type them into cents', () => {
    expect(readMoney('$0.45', usd)).toEqual({ ok: true, cents: 45 });
    expect(readMoney('12.50', usd)).toEqual({ ok: true, cents: 1250 });
    expect(readMoney('12', usd)).toEqual({ ok: true, cents: 1200 });
    expect(readMoney(' 1,200.5 ', usd)).toEqual({ ok: true, cents: 120050 });
    expect(readMoney('.5', usd)).toEqual({ ok: true, cents: 50 });
    expect(readMoney('USD 3', usd)).toEqual({ ok: true, cents: 300 });
  });

  it('follows the locale’s decimal mark and the currency’s minor units (ISO 4217: JPY has none)', () => {
    expect(readMoney('12,50 €', eur)).toEqual({ ok: true, cents: 1250 });
    expect(readMoney('1.200,00', eur)).toEqual({ ok: true, cents: 120000 });
    expect(readMoney('¥1,200', jpy)).toEqual({ ok: true, cents: 1200 });
    expect(readMoney('1200.5', jpy).ok).toBe(false);
  });

  it('refuses what is not an amount, in words', () => {
    expect(readMoney('', usd)).toEqual({ ok: false, message: 'Enter an amount, like 12.50' });
    expect(readMoney('abc', usd)).toEqual({ ok: false, message: 'is not an amount' });
    expect(readMoney('-3', usd)).toEqual({ ok: false, message: 'must not be negative' });
    expect(readMoney('1.234', usd)).toEqual({ ok: false, message: 'has more than 2 digits after the .' });
    // "1,5" in en-US is not fifteen dollars: a comma groups thousands there.
    expect(readMoney('1,5', usd)).toEqual({ ok: false, message: 'is not an amount: use . for the cents' });
    expect(readMoney('1.2.3', usd).ok).toBe(false);
    expect(readMoney('99999999999', usd)).toEqual({ ok: false, message: 'is too large' });
  });

  it('reads back what it writes, for every amount (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 2_000_000_000 }), (cents) => {
        expect(readMoney(moneyInputText(cents, usd), usd)).toEqual({ ok: true, cents });
        expect(readMoney(moneyInputText(cents, eur), eur)).toEqual({ ok: true, cents });
      }),
    );
  });
});
