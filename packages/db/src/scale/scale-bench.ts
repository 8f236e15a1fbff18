// One company's bench in the scale data: 1–3 boards per model with their parts lists (the largest company also has a
// few 400-part main boards), the boards fitted in most games (the power supply nearly always), cabinet profiles,
// bench templates, and on a share of boards two or three overhauls years apart, each reading judged by the domain
// code: overhauls since the company started on Bumperline are finished bench jobs (readings, diode sets, parts used,
// a photo); older ones are readings copied from paper. A few jobs are in progress, some for a game in the shop.
import type { BenchJobDraft, BenchStep, BenchStepProgress } from '@bumperline/contracts/bench-vocabulary';
import {
  BRIDGE_READING_KEYS,
  diodeSetText,
  judgeDiodeSet,
  judgeReading,
  partsForStep,
  type BenchPart,
} from '@bumperline/domain/components/bench-judgement';
import { parseManufactureDate } from '@bumperline/domain/components/date-codes';
import type { PartSpec } from '@bumperline/domain/components/parts-list-entry';
import { isDomainError } from '@bumperline/domain/errors';
import { powerSupplyRecapTemplate, soundBoardReflowTemplate } from '../demo/bench-templates.ts';
import { mainBoard400, otherBoardDesigns, powerSupplyDesigns, type BoardDesign } from './scale-board-designs.ts';
import type { Dice } from './dice.ts';
import type { ModelKind } from './scale-names.ts';
import type { ScaleTables } from './scale-tables.ts';

const DAY = 24 * 60 * 60_000;
const YEAR = 365 * DAY;

/** Share of fitted power supplies, and of other boards, with overhauls on record. */
const HISTORY_SHARE = { powerSupply: 0.35, other: 0.1 };
/** Share of fitted boards with a job open on the bench now (beside every game in the shop). */
const IN_PROGRESS_SHARE = 0.012;
/** Share of games whose cabinet temperatures were profiled. */
const PROFILED_SHARE = 0.3;
/** Spare boards on the shelf, per game. */
const SPARE_SHARE = 0.01;

export interface BenchContext {
  tables: ScaleTables;
  /** The bench's own draws, so the rest of the scale data stays as it was without them. */
  dice: Dice;
  now: number;
}

export interface BenchModel {
  id: string;
  kind: ModelKind;
  year: number;
}

export interface BenchGame {
  id: string;
  modelId: string;
  installedAt: number;
  /** The call open now, if any: a game in the shop has its power supply on the bench. */
  openCall?: { id: string; state: string };
}

interface CompanyBoard {
  id: string;
  model: BenchModel;
  design: BoardDesign;
  isPowerSupply: boolean;
  partIds: string[];
  /** The parts as a bench job sees them (spec and id), for partsForStep. */
  benchParts: BenchPart[];
  /** A resistor taken off the list in a revision, kept for the readings taken on it before. */
  removed?: { id: string; position: number };
}

interface Template {
  id: string;
  name: string;
  steps: BenchStep[];
  /** The steps as COPY writes them, made once. */
  stepsJson: string;
}

/** Cabinet days: [hours, °C] (bars warm up in the evening; the last one stands by a sunny window). */
const cabinetDays = [
  [
    { hours: 3, temperatureC: 30 },
    { hours: 5, temperatureC: 40 },
    { hours: 4, temperatureC: 48 },
  ],
  [
    { hours: 4, temperatureC: 32 },
    { hours: 6, temperatureC: 44 },
  ],
  [
    { hours: 6, temperatureC: 28 },
    { hours: 6, temperatureC: 38 },
    { hours: 2, temperatureC: 45 },
  ],
  [
    { hours: 5, temperatureC: 38 },
    { hours: 7, temperatureC: 50 },
    { hours: 4, temperatureC: 42 },
  ],
];

const serialPrefixes: Record<string, string> = { 'Power supply': 'PS', 'Sound board': 'SB', 'Driver board': 'DR' };
const pad2 = (n: number) => String(n).padStart(2, '0');
const isoDate = (ms: number) => new Date(ms).toISOString().slice(0, 10);
const dayOf = (date: string) => Date.parse(`${date}T00:00:00Z`);

/** How a technician types a meter's reading: three significant figures with the prefix ("4.62k", "612"). */
function typedOhms(ohms: number): string {
  if (ohms >= 1e6) return `${Number((ohms / 1e6).toPrecision(3))}M`;
  if (ohms >= 1e3) return `${Number((ohms / 1e3).toPrecision(3))}k`;
  return String(Number(ohms.toPrecision(3)));
}

/** A healthy diode or bridge on the diode test: about half a volt forward, open (OL) in reverse. */
function goodDiodeReadings(kind: string, forward: string): Record<string, string> {
  if (kind === 'diode') return { forward, reverse: 'OL' };
  // A leg conducts with red on its anode: an AC terminal to +, or − to an AC terminal.
  const conducts = (k: (typeof BRIDGE_READING_KEYS)[number]) => k.black === '+' || k.red === '-';
  return Object.fromEntries(BRIDGE_READING_KEYS.filter((k) => k.required).map((k) => [k.key, conducts(k) ? forward : 'OL']));
}

const fresh = (): BenchStepProgress => ({
  done: false,
  acknowledged: false,
  answer: null,
  note: '',
  readings: {},
  diodes: {},
  fuses: {},
  power: {},
});

export class CompanyBench {
  private readonly boardsByModel = new Map<string, CompanyBoard[]>();
  private readonly boards: CompanyBoard[] = [];
  private readonly recap: Template;
  private readonly reflow: Template;
  private readonly today: string;
  private games = 0;

  constructor(
    private readonly ctx: BenchContext,
    /** `start`: where the company's data begins; overhauls before it were on paper, not bench jobs. */
    private readonly company: { tenantId: string; start: number; technicians: readonly { id: string }[] },
    models: readonly BenchModel[],
    largest: boolean,
  ) {
    const { dice } = ctx;
    this.today = isoDate(ctx.now);
    this.recap = this.template(powerSupplyRecapTemplate.name, powerSupplyRecapTemplate.description, powerSupplyRecapTemplate.steps);
    this.template(soundBoardReflowTemplate.name, soundBoardReflowTemplate.description, soundBoardReflowTemplate.steps);
    this.reflow = this.template(
      'Board reflow and resistor check',
      'Headers and heavy joints reflowed, worn connectors replaced, resistors measured, powered up and tested in the game.',
      soundBoardReflowTemplate.steps,
    );
    if (largest) {
      const byKey = new Map(powerSupplyRecapTemplate.steps.map((s) => [s.key, s]));
      const only = (...keys: string[]) => keys.map((k) => byKey.get(k)!);
      this.template(
        'Power supply fuse and output check',
        'A quick visit: fuses checked against the parts list, outputs read under load. No soldering.',
        only('unplug', 'discharge', 'inspect', 'fuses', 'power-up'),
      );
      this.template(
        'Rectifier replacement',
        'Bridge rectifiers and diodes replaced and mounted raised, joints reflowed, outputs checked.',
        only('unplug', 'discharge', 'inspect', 'rectifiers', 'reflow', 'power-up'),
      );
    }

    for (const [m, model] of models.entries()) {
      const designs = [dice.pick(powerSupplyDesigns[model.kind])];
      const others = [...otherBoardDesigns[model.kind]];
      const count = dice.int(1, 3);
      while (designs.length < count && others.length) designs.push(others.splice(dice.int(0, others.length - 1), 1)[0]!);
      // The largest company's first few models carry the 400-part main board (as their last board, of at most three).
      if (largest && m < 4) designs.splice(Math.min(designs.length, 2), 1, mainBoard400);
      const boards = designs.map((d, i) => this.addBoard(model, d, i === 0));
      this.boardsByModel.set(model.id, boards);
    }
  }

  private template(name: string, description: string, steps: readonly BenchStep[]): Template {
    const t = { id: this.ctx.dice.uuid(), name, steps: [...steps], stepsJson: JSON.stringify(steps) };
    const at = new Date(this.company.start);
    this.ctx.tables.benchTemplates.add({
      tenant_id: this.company.tenantId,
      id: t.id,
      name,
      description,
      steps: t.stepsJson,
      version: 1,
      created_at: at,
      updated_at: at,
    });
    return t;
  }

  private addBoard(model: BenchModel, design: BoardDesign, isPowerSupply: boolean): CompanyBoard {
    const { tables: t, dice } = this.ctx;
    const id = dice.uuid();
    const created = new Date(this.company.start + dice.int(0, 60) * DAY);
    t.modelBoards.add({
      tenant_id: this.company.tenantId,
      id,
      model_id: model.id,
      name: design.name,
      part_number: design.partNumber,
      notes: design.notes,
      version: dice.int(1, 4),
      created_at: created,
      updated_at: created,
    });
    const partIds = design.parts.map((p, i) => {
      const partId = dice.uuid();
      t.boardParts.add({
        tenant_id: this.company.tenantId,
        id: partId,
        board_id: id,
        position: i + 1,
        designator: p.designator,
        kind: p.kind,
        value: p.value,
        tolerance: p.tolerance,
        rating: p.rating,
        rated_temperature_c: p.ratedTemperatureC,
        rated_life_hours: p.ratedLifeHours,
        notes: p.notes,
        removed_at: null,
      });
      return partId;
    });
    const board: CompanyBoard = {
      id,
      model,
      design,
      isPowerSupply,
      partIds,
      benchParts: design.specs.flatMap((spec, i) => (spec ? [{ ...spec, id: partIds[i]! }] : [])),
    };
    // Some lists lost a resistor in a revision: it stays (removed) so the readings taken on it keep their part.
    const resistor = design.measurable.length ? design.measurable[dice.int(0, design.measurable.length - 1)]! : undefined;
    if (resistor !== undefined && dice.chance(0.15)) {
      const p = design.parts[resistor]!;
      const removedId = dice.uuid();
      const designator = `${p.designator}A`;
      t.boardParts.add({
        tenant_id: this.company.tenantId,
        id: removedId,
        board_id: id,
        position: design.parts.length + 1,
        designator,
        kind: p.kind,
        value: p.value,
        tolerance: p.tolerance,
        rating: p.rating,
        rated_temperature_c: null,
        rated_life_hours: null,
        notes: 'taken off in the board revision',
        removed_at: created,
      });
      board.removed = { id: removedId, position: resistor };
    }
    this.boards.push(board);
    return board;
  }

  /** Every parts-list entry of the company's boards (the catalogue's fits are matched against them). */
  partsListEntries(): { id: string; kind: string; value: string; rating: string }[] {
    return this.boards.flatMap((board) =>
      board.design.parts.map((part, i) => ({ id: board.partIds[i]!, kind: part.kind, value: part.value, rating: part.rating })),
    );
  }

  /** The boards in one game, their cabinet profile, and what the bench did to them. */
  fitGame(game: BenchGame): void {
    const { dice } = this.ctx;
    this.games++;
    const boards = this.boardsByModel.get(game.modelId) ?? [];
    for (const board of boards) {
      if (!dice.chance(board.isPowerSupply ? 0.92 : 0.55)) continue;
      const shopCall = board.isPowerSupply && game.openCall?.state === 'at_shop' ? game.openCall.id : undefined;
      this.fitBoard(board, game.id, game.installedAt, shopCall);
    }
    if (dice.chance(PROFILED_SHARE)) {
      this.ctx.tables.cabinetProfiles.add({
        tenant_id: this.company.tenantId,
        game_id: game.id,
        slices: dice.pick(cabinetDays),
        updated_at: new Date(Math.max(game.installedAt, this.company.start) + dice.int(0, 300) * DAY),
      });
    }
  }

  /** Spare boards on the shelf, in no game. */
  finish(): void {
    const { dice } = this.ctx;
    const spares = Math.round(this.games * SPARE_SHARE);
    for (let i = 0; i < spares && this.boards.length; i++) this.fitBoard(dice.pick(this.boards), null, this.company.start, undefined);
  }

  /** A date code as printed, and what it reads as: a date, a flag when it reads two ways, or nothing. */
  private dateCode(model: BenchModel) {
    const { dice } = this.ctx;
    const year = Math.min(new Date(this.ctx.now).getUTCFullYear() - 1, model.year - 1 + dice.int(0, 3));
    const week = dice.int(1, 52);
    const roll = dice.float();
    if (roll < 0.04) return { dateCode: '', madeOn: null, flag: null };
    const dateCode = roll < 0.12 ? `${year}-W${pad2(week)}` : `${pad2(year % 100)}${pad2(week)}`;
    try {
      return { dateCode, madeOn: parseManufactureDate(dateCode, this.today).date, flag: null };
    } catch (error) {
      if (!isDomainError(error)) throw error;
      // "2012": the year 2012 or week 12 of 2020 — flagged for a person to settle, never guessed.
      if (error.code === 'ambiguous') return { dateCode, madeOn: null, flag: error.message };
      return { dateCode: '', madeOn: null, flag: null };
    }
  }

  private fitBoard(board: CompanyBoard, gameId: string | null, fittedAt: number, shopCallId: string | undefined): void {
    const { tables: t, dice, now } = this.ctx;
    const id = dice.uuid();
    const dated = this.dateCode(board.model);
    const madeMs = dated.madeOn ? dayOf(dated.madeOn) : Date.UTC(board.model.year, 0, 1);

    // Overhauls: the latest within the last three years, the ones before it four to eight years apart.
    let overhauls: number[] = [];
    if (dice.chance(board.isPowerSupply ? HISTORY_SHARE.powerSupply : HISTORY_SHARE.other)) {
      const count = dice.int(2, 3);
      overhauls = [now - dice.int(20, 3 * 365) * DAY];
      while (overhauls.length < count) {
        const earlier = overhauls[0]! - dice.int(4 * 365, 8 * 365) * DAY;
        if (earlier < madeMs + YEAR) break;
        overhauls.unshift(earlier);
      }
      overhauls = overhauls.filter((at) => at > madeMs + YEAR);
    }
    // A power supply's last overhaul was its recap; otherwise a recap on record for most, long ago or recently.
    let lastRecapOn: string | null = null;
    if (board.isPowerSupply && overhauls.length) lastRecapOn = isoDate(overhauls[overhauls.length - 1]!);
    else if (dice.chance(0.7)) {
      const at = dice.chance(0.3) ? madeMs + dice.int(6, 12) * YEAR : now - dice.int(60, 6 * 365) * DAY;
      if (at > madeMs && at < now) lastRecapOn = isoDate(at);
    }
    const created = new Date(Math.max(fittedAt, this.company.start));
    t.boardInstances.add({
      tenant_id: this.company.tenantId,
      id,
      board_id: board.id,
      game_id: gameId,
      serial: `${serialPrefixes[board.design.name] ?? 'BD'}-${dice.int(10000, 99999)}`,
      date_code: dated.dateCode,
      made_on: dated.madeOn,
      date_code_flag: dated.flag,
      last_recap_on: lastRecapOn,
      notes: dice.chance(0.03) ? 'Reflowed at the headers by a previous owner.' : '',
      version: 1 + overhauls.length,
      created_at: created,
      updated_at: new Date(Math.max(created.getTime(), overhauls[overhauls.length - 1] ?? 0)),
    });
    if (overhauls.length) this.overhaulHistory(board, id, overhauls);
    if (shopCallId || dice.chance(IN_PROGRESS_SHARE)) this.jobInProgress(board, id, shopCallId);
  }

  /** Each overhaul's resistor readings drifting a little further from nominal; recent ones are finished bench jobs. */
  private overhaulHistory(board: CompanyBoard, instanceId: string, overhauls: number[]): void {
    const { dice } = this.ctx;
    const technician = dice.pick(this.company.technicians).id;
    const drift = board.design.measurable.map(() => {
      // Where a part started and how fast it drifts, as fractions of its tolerance; one in twenty runs away.
      const start = (dice.float() - 0.5) * 0.5;
      const rate = dice.chance(0.05) ? 0.45 + dice.float() * 0.3 : dice.float() * 0.22;
      return { start, rate };
    });
    overhauls.forEach((at, k) => {
      const jobId = at >= this.company.start ? dice.uuid() : null;
      const typed: Record<string, { text: string; inCircuit: boolean }> = {};
      board.design.measurable.forEach((position, i) => {
        const spec = board.design.specs[position]!;
        const tolerance = spec.tolerance!.kind === 'percent' ? spec.tolerance!.plus : 5;
        const percent = (drift[i]!.start + drift[i]!.rate * k) * tolerance;
        // Now and then read in circuit, where a parallel path pulls it low: only indicative.
        const inCircuit = jobId !== null && dice.chance(0.04);
        const text = typedOhms(spec.nominal! * (1 + percent / 100) * (inCircuit ? 0.85 : 1));
        const partId = board.partIds[position]!;
        this.reading(instanceId, partId, jobId, text, inCircuit, at, technician, spec);
        typed[partId] = { text, inCircuit };
        // The resistor taken off the list was read only on paper, before the revision.
        if (board.removed?.position === position && jobId === null) {
          this.reading(instanceId, board.removed.id, null, text, false, at, technician, spec);
        }
      });
      if (jobId) this.finishedJob(board, instanceId, jobId, at, technician, typed);
    });
  }

  private reading(
    instanceId: string,
    partId: string,
    jobId: string | null,
    text: string,
    inCircuit: boolean,
    at: number,
    takenBy: string,
    spec: PartSpec,
  ) {
    const judged = judgeReading(spec, text, inCircuit);
    if (!judged.ok) throw new Error(`scale data: ${spec.designator} "${text}" does not judge: ${judged.message}`);
    const j = judged.value;
    this.ctx.tables.partReadings.add({
      tenant_id: this.company.tenantId,
      id: this.ctx.dice.uuid(),
      board_instance_id: instanceId,
      part_id: partId,
      bench_job_id: jobId,
      measured_text: text,
      measured: j.measured,
      unit: j.unit,
      in_circuit: inCircuit,
      verdict: j.verdict,
      indicative: j.indicative,
      min: j.min,
      max: j.max,
      deviation_percent: j.deviationPercent,
      note: j.note,
      taken_at: new Date(at),
      taken_by: takenBy,
    });
  }

  /** A finished job: every step ticked (cautions acknowledged), its draft as typed, its diode sets, parts used, photo. */
  private finishedJob(
    board: CompanyBoard,
    instanceId: string,
    jobId: string,
    at: number,
    technician: string,
    typed: Record<string, { text: string; inCircuit: boolean }>,
  ) {
    const { tables: t, dice } = this.ctx;
    const template = board.isPowerSupply ? this.recap : this.reflow;
    const draft: BenchJobDraft = { steps: {}, partsUsed: [] };
    for (const step of template.steps) {
      const progress: BenchStepProgress = {
        ...fresh(),
        done: true,
        acknowledged: step.cautions.length > 0,
        answer: step.record === 'check' ? 'yes' : null,
      };
      const parts = partsForStep(step, board.benchParts);
      if (step.record === 'readings') progress.readings = typed;
      else if (step.record === 'fuse') {
        for (const p of parts)
          if (p.kind === 'fuse') progress.fuses[p.id] = { fitted: board.design.parts[board.partIds.indexOf(p.id)]!.value };
      } else if (step.record === 'diode_set') {
        for (const p of parts) {
          const readings = goodDiodeReadings(p.kind, `0.${dice.int(48, 62)}`);
          progress.diodes[p.id] = readings;
          const judged = judgeDiodeSet(p, readings);
          if (!judged.ok) throw new Error(`scale data: ${p.designator} diode set does not judge: ${judged.message}`);
          t.partReadings.add({
            tenant_id: this.company.tenantId,
            id: dice.uuid(),
            board_instance_id: instanceId,
            part_id: p.id,
            bench_job_id: jobId,
            measured_text: diodeSetText(readings),
            measured: null,
            unit: null,
            in_circuit: false,
            verdict: judged.value.verdict ?? 'fail',
            indicative: false,
            min: null,
            max: null,
            deviation_percent: null,
            note: judged.value.detail,
            taken_at: new Date(at),
            taken_by: technician,
          });
        }
      } else if (step.record === 'parts_used') {
        // Every electrolytic on a recap; the odd worn header.
        for (const p of parts) {
          if (p.kind !== 'electrolytic' && !dice.chance(0.25)) continue;
          const entry = board.design.parts[board.partIds.indexOf(p.id)]!;
          draft.partsUsed.push({ partId: p.id, description: `${p.designator}: ${entry.value} ${entry.rating}`.trim(), quantity: 1 });
        }
      } else if (step.record === 'photo') {
        const photoId = dice.uuid();
        t.benchJobPhotos.add({
          tenant_id: this.company.tenantId,
          id: photoId,
          job_id: jobId,
          step_key: step.key,
          storage_key: `scale/${photoId}.jpg`,
          thumb_key: `scale/${photoId}-thumb.webp`,
          content_type: 'image/jpeg',
          bytes: dice.int(150_000, 600_000),
          width: 1600,
          height: 1200,
          uploaded_by: technician,
          created_at: new Date(at),
        });
      }
      draft.steps[step.key] = progress;
    }
    for (const used of draft.partsUsed) {
      t.benchJobPartsUsed.add({
        tenant_id: this.company.tenantId,
        id: dice.uuid(),
        job_id: jobId,
        part_id: used.partId,
        description: used.description,
        quantity: used.quantity,
      });
    }
    const opened = at - dice.int(2, 30) * 60 * 60_000;
    t.benchJobs.add({
      tenant_id: this.company.tenantId,
      id: jobId,
      board_instance_id: instanceId,
      template_id: template.id,
      template_name: template.name,
      steps: template.stepsJson,
      origin: 'game',
      service_call_id: null,
      state: 'finished',
      draft,
      version: dice.int(8, 60),
      opened_by: technician,
      opened_at: new Date(opened),
      updated_at: new Date(at),
      finished_by: technician,
      finished_at: new Date(at),
    });
  }

  /** A job left part-way: the safe steps done, the fuses read, some resistors measured. */
  private jobInProgress(board: CompanyBoard, instanceId: string, shopCallId: string | undefined) {
    const { dice, now } = this.ctx;
    const template = board.isPowerSupply ? this.recap : this.reflow;
    const technician = dice.pick(this.company.technicians).id;
    const draft: BenchJobDraft = { steps: Object.fromEntries(template.steps.map((s) => [s.key, fresh()])), partsUsed: [] };
    const reached = dice.int(1, template.steps.length - 1);
    template.steps.slice(0, reached).forEach((step, i) => {
      const progress = draft.steps[step.key]!;
      const last = i === reached - 1;
      progress.done = !last;
      progress.acknowledged = step.cautions.length > 0;
      progress.answer = step.record === 'check' && !last ? 'yes' : null;
      const parts = partsForStep(step, board.benchParts);
      if (step.record === 'fuse') {
        for (const p of parts)
          if (p.kind === 'fuse') progress.fuses[p.id] = { fitted: board.design.parts[board.partIds.indexOf(p.id)]!.value };
      } else if (step.record === 'readings') {
        for (const position of board.design.measurable) {
          if (last && dice.chance(0.5)) break;
          const spec = board.design.specs[position]!;
          progress.readings[board.partIds[position]!] = { text: typedOhms(spec.nominal! * (0.98 + dice.float() * 0.04)), inCircuit: false };
        }
      }
    });
    const opened = now - Math.min(20 * DAY, dice.exponential(3 * DAY)) - 3_600_000;
    this.ctx.tables.benchJobs.add({
      tenant_id: this.company.tenantId,
      id: dice.uuid(),
      board_instance_id: instanceId,
      template_id: template.id,
      template_name: template.name,
      steps: template.stepsJson,
      origin: shopCallId ? 'service_call' : 'game',
      service_call_id: shopCallId ?? null,
      state: 'in_progress',
      draft,
      version: dice.int(2, 40),
      opened_by: technician,
      opened_at: new Date(opened),
      updated_at: new Date(opened + dice.float() * (now - opened)),
      finished_by: null,
      finished_at: null,
    });
  }
}
