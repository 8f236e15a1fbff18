import { describe, expect, it } from 'vitest';
import { formatHours, readHours, readTemperature } from './cabinet-entry.ts';

const value = (r: ReturnType<typeof readHours>) => (r.ok ? r.value : r.message);

describe('readHours', () => {
  it('reads hours as people say them', () => {
    expect(value(readHours('4 h'))).toBe(4);
    expect(value(readHours('4h'))).toBe(4);
    expect(value(readHours(' 6 hours '))).toBe(6);
    expect(value(readHours('4'))).toBe(4);
    expect(value(readHours('4.5 hrs'))).toBe(4.5);
    expect(value(readHours('4,5 h'))).toBe(4.5);
    expect(value(readHours('90 min'))).toBe(1.5);
    expect(value(readHours('4 h 30 min'))).toBe(4.5);
    expect(value(readHours('1:20'))).toBe(80 / 60);
  });

  it('refuses what is not a number of hours, zero, and more than a day', () => {
    expect(readHours('')).toEqual({ ok: false, message: 'enter how many hours, such as 4 h' });
    expect(value(readHours('abc'))).toMatch(/not a number of hours/);
    expect(value(readHours('4 °C'))).toMatch(/not a number of hours/);
    expect(value(readHours('4 days'))).toMatch(/not a number of hours/);
    expect(value(readHours('0 h'))).toBe('must be more than 0 h');
    expect(value(readHours('-2 h'))).toBe('must be more than 0 h');
    expect(value(readHours('25 h'))).toBe('a day has 24 hours');
  });
});

describe('readTemperature', () => {
  it('reads °C with or without the unit', () => {
    expect(value(readTemperature('45 °C'))).toBe(45);
    expect(value(readTemperature('45°C'))).toBe(45);
    expect(value(readTemperature('45'))).toBe(45);
    expect(value(readTemperature('45 C'))).toBe(45);
    expect(value(readTemperature('37,5 °C'))).toBe(37.5);
    expect(value(readTemperature('-5 °C'))).toBe(-5);
  });

  it('turns °F into °C (°C = (°F − 32) × 5/9; 113 °F is 45 °C)', () => {
    expect(value(readTemperature('113 °F'))).toBe(45);
    expect(value(readTemperature('100F'))).toBe(37.8);
  });

  it('refuses text that is not a temperature', () => {
    expect(value(readTemperature(''))).toMatch(/enter the temperature/);
    expect(value(readTemperature('warm'))).toMatch(/not a temperature/);
    expect(value(readTemperature('45 K'))).toMatch(/not a temperature/);
  });
});

describe('formatHours', () => {
  it('shows hours back the way they are typed', () => {
    expect(formatHours(4)).toBe('4 h');
    expect(formatHours(4.5)).toBe('4.5 h');
    expect(formatHours(80 / 60)).toBe('1 h 20 min');
    expect(formatHours(0.25)).toBe('15 min');
  });
});
