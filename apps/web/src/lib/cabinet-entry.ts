// Reading a cabinet profile as people type it: "4 h", "4.5 hours", "90 min" for how long; "45 °C", "45", "113 °F"
// for how warm. The API takes hours and °C as numbers; these turn the text into them, or say what is wrong.

export type Read = { ok: true; value: number } | { ok: false; message: string };

/** "4.5" or "4,5" (a decimal comma, as much of the world writes it); no thousands separators in hours or °C. */
function readNumber(text: string): number | null {
  if (!/^[-−]?\d+([.,]\d+)?$/.test(text)) return null;
  return Number(text.replace(',', '.').replace('−', '-'));
}

const HOUR_WORDS = new Set(['h', 'hr', 'hrs', 'hour', 'hours']);
const MINUTE_WORDS = new Set(['m', 'min', 'mins', 'minute', 'minutes']);

/** Hours powered: a bare number is hours; "h"/"hours" or "min"/"minutes" may follow; "4 h 30 min" and "4:30" too. */
export function readHours(input: string): Read {
  const text = input.trim().toLowerCase();
  if (text === '') return { ok: false, message: 'enter how many hours, such as 4 h' };
  const clock = /^(\d{1,2}):([0-5]\d)$/.exec(text);
  let hours: number | null = null;
  if (clock) {
    hours = Number(clock[1]) + Number(clock[2]) / 60;
  } else {
    const both = /^(\S+?)\s*(h|hrs?|hours?)\s*(\S+?)\s*(m|mins?|minutes?)$/.exec(text);
    if (both) {
      const h = readNumber(both[1]!);
      const m = readNumber(both[3]!);
      if (h !== null && m !== null) hours = h + m / 60;
    } else {
      const one = /^(\S+?)\s*([a-z]*)$/.exec(text);
      const n = one ? readNumber(one[1]!) : null;
      const unit = one?.[2] ?? '';
      if (n !== null && (unit === '' || HOUR_WORDS.has(unit))) hours = n;
      else if (n !== null && MINUTE_WORDS.has(unit)) hours = n / 60;
    }
  }
  if (hours === null) return { ok: false, message: `"${input.trim()}" is not a number of hours: write it as 4 h, 4.5 h or 90 min` };
  if (hours <= 0) return { ok: false, message: 'must be more than 0 h' };
  if (hours > 24) return { ok: false, message: 'a day has 24 hours' };
  // To the minute: nobody profiles a cabinet finer, and 1/60 h would not round-trip as typed.
  return { ok: true, value: Math.round(hours * 60) / 60 };
}

/** A cabinet temperature: a bare number is °C; "°C", "C", "deg" may follow, and "°F"/"F" is turned into °C. */
export function readTemperature(input: string): Read {
  const text = input.trim();
  if (text === '') return { ok: false, message: 'enter the temperature inside the cabinet, such as 45 °C' };
  const m = /^(\S+?)\s*(°\s*[cf]|º\s*[cf]|[cf]|deg(?:rees)?\s*[cf]?|degrees?)?$/i.exec(text);
  const n = m ? readNumber(m[1]!) : null;
  if (!m || n === null) return { ok: false, message: `"${text}" is not a temperature: write it as 45 °C or 45` };
  const fahrenheit = /f$/i.test(m[2] ?? '');
  const celsius = fahrenheit ? ((n - 32) * 5) / 9 : n;
  return { ok: true, value: Math.round(celsius * 10) / 10 };
}

/** How an hours value is shown back in the form: "4 h", "4.5 h", "1 h 20 min". */
export function formatHours(hours: number): string {
  const minutes = Math.round(hours * 60);
  const whole = Math.floor(minutes / 60);
  const rest = minutes % 60;
  if (rest === 0) return `${whole} h`;
  if (rest === 30) return `${whole}.5 h`;
  return whole === 0 ? `${rest} min` : `${whole} h ${rest} min`;
}

export const formatTemperature = (celsius: number) => `${celsius} °C`;
