// What this device typed that the other device's draft does not hold: shown after "load theirs" so nothing
// typed here is lost without the technician seeing it.
import type { BenchJobDraft } from '@bumperline/contracts/bench-vocabulary';

export type UnsentWhat = 'done' | 'acknowledged' | 'answer' | 'note' | 'reading' | 'inCircuit' | 'diode' | 'fitted' | 'volts' | 'partUsed';

export interface UnsentChange {
  what: UnsentWhat;
  /** The step it belongs to (null for parts used, which belong to the job). */
  stepKey: string | null;
  partId: string | null;
  /** A diode-test leg ("forward", a bridge leg). */
  leg: string | null;
  /** As typed here, and as the other device has it ('' when it has nothing). */
  mine: string;
  theirs: string;
}

type Flat = Map<string, Omit<UnsentChange, 'mine' | 'theirs'> & { value: string }>;

const yesNo = (b: boolean | undefined) => (b ? 'yes' : 'no');

function flatten(draft: BenchJobDraft): Flat {
  const out: Flat = new Map();
  const put = (path: string, entry: Omit<UnsentChange, 'mine' | 'theirs'>, value: string) => out.set(path, { ...entry, value });
  for (const [stepKey, p] of Object.entries(draft.steps ?? {})) {
    const at = (what: UnsentWhat, partId: string | null = null, leg: string | null = null) => ({ what, stepKey, partId, leg });
    put(`${stepKey}.done`, at('done'), yesNo(p.done));
    put(`${stepKey}.acknowledged`, at('acknowledged'), yesNo(p.acknowledged));
    put(`${stepKey}.answer`, at('answer'), p.answer ?? '');
    put(`${stepKey}.note`, at('note'), p.note ?? '');
    for (const [partId, r] of Object.entries(p.readings ?? {})) {
      put(`${stepKey}.readings.${partId}`, at('reading', partId), r.text);
      put(`${stepKey}.inCircuit.${partId}`, at('inCircuit', partId), yesNo(r.inCircuit));
    }
    for (const [partId, legs] of Object.entries(p.diodes ?? {})) {
      for (const [leg, text] of Object.entries(legs)) put(`${stepKey}.diodes.${partId}.${leg}`, at('diode', partId, leg), text);
    }
    for (const [partId, f] of Object.entries(p.fuses ?? {})) put(`${stepKey}.fuses.${partId}`, at('fitted', partId), f.fitted);
    for (const [partId, v] of Object.entries(p.power ?? {})) put(`${stepKey}.power.${partId}`, at('volts', partId), v.volts);
  }
  // Parts used are a list without ids: an entry counts as the same when its part, words and quantity match.
  const seen = new Map<string, number>();
  for (const u of draft.partsUsed ?? []) {
    const id = `${u.partId ?? ''}|${u.description}|${u.quantity}`;
    const n = (seen.get(id) ?? 0) + 1;
    seen.set(id, n);
    out.set(`partsUsed.${id}#${n}`, {
      what: 'partUsed',
      stepKey: null,
      partId: u.partId,
      leg: null,
      value: `${u.description} × ${u.quantity}`,
    });
  }
  return out;
}

/** Blank values ("", "no") are what an untouched field holds. */
const blank = (v: string | undefined) => v === undefined || v === '' || v === 'no';

/**
 * Each value this device changed since `base` (what both last agreed on) that differs from `theirs`.
 * A value this device never touched is theirs to keep and is not listed.
 */
export function unsentChanges(base: BenchJobDraft, mine: BenchJobDraft, theirs: BenchJobDraft): UnsentChange[] {
  const b = flatten(base);
  const m = flatten(mine);
  const t = flatten(theirs);
  const out: UnsentChange[] = [];
  for (const [path, entry] of m) {
    const before = b.get(path)?.value;
    const other = t.get(path)?.value;
    const changedHere = entry.value !== before && !(blank(entry.value) && blank(before));
    const differs = entry.value !== other && !(blank(entry.value) && blank(other));
    if (changedHere && differs) {
      const { value, ...where } = entry;
      out.push({ ...where, mine: value, theirs: other ?? '' });
    }
  }
  return out;
}
