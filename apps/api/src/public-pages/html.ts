// A tiny HTML builder for the server-rendered pages: every interpolated value is escaped unless it is
// markup this module built itself, so text typed by the public (a note, a venue name) always comes back inert.

const SAFE = Symbol('safe-html');

export interface SafeHtml {
  readonly [SAFE]: true;
  readonly value: string;
}

type Part = SafeHtml | string | number | null | undefined | false | readonly Part[];

const ENTITIES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ENTITIES[c]!);
}

function isSafe(part: unknown): part is SafeHtml {
  return typeof part === 'object' && part !== null && SAFE in part;
}

function render(part: Part): string {
  if (part === null || part === undefined || part === false) return '';
  if (Array.isArray(part)) return part.map(render).join('');
  if (isSafe(part)) return part.value;
  return escapeHtml(String(part));
}

/** Markup we wrote ourselves, to be inserted as is. Never pass it text from a request or the database. */
export function trusted(raw: string): SafeHtml {
  return { [SAFE]: true, value: raw };
}

/**
 * markup`<p>${text}</p>`: the template's literal parts are markup, the interpolated parts are escaped.
 * (Not named `html`, so Prettier leaves the markup alone: reflowing it would change a textarea's text.)
 */
export function markup(strings: TemplateStringsArray, ...parts: Part[]): SafeHtml {
  let out = strings[0] ?? '';
  parts.forEach((part, i) => {
    out += render(part) + (strings[i + 1] ?? '');
  });
  return trusted(out);
}
