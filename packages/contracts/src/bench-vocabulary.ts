// Words and closed sets of the bench: part kinds, cautions, what a step records, a bench job's states, a
// reading's verdict. No zod here: the web app's bench screens import these values without downloading zod.

/** What a parts-list entry is; decides which unit its value is written in. */
export const partKinds = [
  'resistor',
  'capacitor',
  'electrolytic',
  'diode',
  'bridge_rectifier',
  'fuse',
  'connector',
  'transistor',
  'regulator',
  'other',
] as const;
export type PartKind = (typeof partKinds)[number];

export const partKindLabels: Record<PartKind, string> = {
  resistor: 'Resistor',
  capacitor: 'Capacitor',
  electrolytic: 'Electrolytic capacitor',
  diode: 'Diode',
  bridge_rectifier: 'Bridge rectifier',
  fuse: 'Fuse',
  connector: 'Connector / header',
  transistor: 'Transistor',
  regulator: 'Regulator',
  other: 'Other',
};

/** The hazards a bench step can involve; each carries the usual caution, acknowledged before the step is ticked. */
/** `mains` is for opening and handling a supply that must be dead; `live_work` for measuring one that is running. */
export const cautionKinds = ['mains', 'live_work', 'charged_capacitors', 'hot_iron', 'solder_fumes', 'leaded_solder'] as const;
export type CautionKind = (typeof cautionKinds)[number];

/** What a template step asks the technician to record. */
export const stepRecordKinds = ['check', 'readings', 'diode_set', 'fuse', 'power', 'parts_used', 'photo', 'note'] as const;
export type StepRecordKind = (typeof stepRecordKinds)[number];

/** A step's kind in words, on the screens and on the printed job sheet. */
export const stepRecordLabels: Record<StepRecordKind, string> = {
  check: 'Yes / no check',
  readings: 'Readings',
  diode_set: 'Diode test',
  fuse: 'Fuse check',
  power: 'Power check',
  parts_used: 'Parts used',
  photo: 'Photo',
  note: 'Note',
};

export const benchJobStates = ['in_progress', 'finished'] as const;
export type BenchJobState = (typeof benchJobStates)[number];

/** Where a bench job was opened from (the care-plan issue opens them on schedule). */
export const benchJobOrigins = ['game', 'service_call', 'care_plan'] as const;
export type BenchJobOrigin = (typeof benchJobOrigins)[number];

/** A stored reading's verdict: a value against its window, or a diode / bridge judged good or not. */
export const readingVerdicts = ['pass', 'low', 'high', 'fail'] as const;
export type ReadingVerdictWord = (typeof readingVerdicts)[number];

/** A board's recap status, by the life left in its electrolytics (the recap list filters on it from the address bar). */
export const recapStatuses = ['overdue', 'due-soon', 'ok', 'unknown', 'no-electrolytics'] as const;
export type RecapStatus = (typeof recapStatuses)[number];

/** The recap list's default and largest page: the server ranks every board but sends only a page of them. */
export const RECAP_FLEET_PAGE = 50;
export const RECAP_FLEET_MAX_PAGE = 200;

/** One step of a bench-job template (kept as JSON on the template, copied onto each job when it opens). */
export interface BenchStep {
  /** Stable within the template: "inspect", "fuses", "measure-resistors". */
  key: string;
  title: string;
  instructions: string;
  record: StepRecordKind;
  /** The parts it concerns: every part of these kinds on the board's parts list … */
  partKinds: PartKind[];
  /** … or these reference designators (either may be empty). */
  designators: string[];
  cautions: CautionKind[];
}

/** What the technician has entered on one step so far: raw text as typed, so nothing is ever lost. */
export interface BenchStepProgress {
  done: boolean;
  /** The step's cautions were read and acknowledged: required before `done` on a step with cautions. */
  acknowledged: boolean;
  /** A yes/no check's answer. */
  answer: 'yes' | 'no' | null;
  note: string;
  /** Per part id: the value read, as typed ("570", "4.63k"), and whether the part was still soldered in. */
  readings: Record<string, { text: string; inCircuit: boolean }>;
  /** Per diode or bridge-rectifier part id: diode-test readings as typed ("0.55", "OL"). A diode has
   * forward/reverse; a bridge has its four legs forward and reverse and the − to + pair. */
  diodes: Record<string, Record<string, string>>;
  /** Per fuse part id: the marking of the fuse fitted ("T2.5A 250V"). */
  fuses: Record<string, { fitted: string }>;
  /** Per resistor part id: the voltage measured across it in operation ("12 V"), checked against its rating. */
  power: Record<string, { volts: string }>;
}

/** A part taken from stock and fitted on the job. */
export interface BenchPartUsed {
  /** The parts-list entry it replaced, when it replaced one. */
  partId: string | null;
  description: string;
  quantity: number;
  /** The catalogue part fitted, when picked from the catalogue: finishing takes it off the finisher's van. */
  cataloguePartId?: string | null;
}

export interface BenchJobDraft {
  steps: Record<string, BenchStepProgress>;
  partsUsed: BenchPartUsed[];
}
