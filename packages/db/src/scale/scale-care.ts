// One company's care plans in the scale data: a plan or two per model (the largest company about 40), each game's
// meters with weekly readings (a year at the largest company, a few months elsewhere) on a smooth seasonal count,
// and the work orders the plans made since the company started — done (labour, meters at done, parts and keep cost
// through scale-stock.ts), a few skipped, and the open ones: a few hundred at the largest company, most planned into
// its technicians' next days, some overdue. Route-day rows for days a dispatcher reordered.
import { occurrencesBetween } from '@bumperline/domain/schedules/recurrence';
import { epochDayFromParts, formatPlainDate } from '@bumperline/domain/plain-date';
import { wallTimeAt } from '@bumperline/domain/schedules/zoned-time';
import type { DueReason, MeterKind } from '@bumperline/contracts/care-vocabulary';
import { textArray } from './copy-table.ts';
import type { Dice } from './dice.ts';
import type { ModelKind } from './scale-names.ts';
import type { ScaleTables } from './scale-tables.ts';
import type { CompanyStock } from './scale-stock.ts';

const HOUR = 3600_000;
const DAY = 24 * HOUR;
/** Days ahead that open work is planned into. */
const PLAN_DAYS = 5;
/** Share of plan-and-game pairs whose last due work slipped and is still open. */
const OVERDUE_SHARE = 0.06;
const skipReasons = ['Venue closed for a private event.', 'Game was off waiting for a part.', 'Manager asked us to come back next week.'];

export interface CareContext {
  tables: ScaleTables;
  dice: Dice;
  now: number;
}

export interface CareCompany {
  tenantId: string;
  /** Where the company's data begins: work orders go back to it. */
  start: number;
  timeZone: string;
  technicians: readonly { id: string; skills: readonly string[] }[];
  dispatcherId: string;
  largest: boolean;
}

interface PlanShape {
  name: string;
  tasks: string[];
  skills: string[];
  onSiteMinutes: number;
  rule?: string;
  playsEvery?: number;
  hoursEvery?: number;
}

/** The plans a model of each kind gets, in trade terms (the demo's wording). */
const plansByKind: Record<ModelKind, PlanShape[]> = {
  pinball: [
    {
      name: 'Monthly playfield clean and rubber check',
      tasks: ['Clean the playfield and wax it', 'Check every rubber ring for cracks; replace worn ones', 'Run the switch test'],
      skills: ['pinball'],
      onSiteMinutes: 45,
      rule: 'FREQ=MONTHLY;BYDAY=-1TU',
      playsEvery: 3_000,
    },
    {
      name: 'Flipper rebuild',
      tasks: ['Replace the coil sleeves and plungers', 'Replace the coil stops', 'Set the flipper alignment'],
      skills: ['pinball'],
      onSiteMinutes: 75,
      playsEvery: 8_000,
    },
    {
      name: 'Fan and playfield lamp check every 1,500 power-on hours',
      tasks: ['Clean the cabinet fan and the vents', 'Replace dead playfield lamps'],
      skills: ['pinball'],
      onSiteMinutes: 35,
      hoursEvery: 1_500,
    },
  ],
  video: [
    {
      name: 'Quarterly coin mech clean',
      tasks: ['Clean the coin mechs and the coin path', 'Test each mech with good and bad coins', 'Clean the bill acceptor sensors'],
      skills: ['video'],
      onSiteMinutes: 30,
      rule: 'FREQ=MONTHLY;INTERVAL=3;BYDAY=3WE',
    },
  ],
  jukebox: [
    {
      name: 'Jukebox yearly service',
      tasks: ['Clean and test every selector button', 'Replace the drive belt if it is glazed', 'Check the amplifier outputs'],
      skills: ['jukebox'],
      onSiteMinutes: 90,
      rule: 'FREQ=YEARLY',
    },
  ],
  darts: [
    {
      name: 'Dartboard segment check every 20,000 plays',
      tasks: ['Run the segment test', 'Replace worn or cracked segments', 'Clear broken tips out of the holes'],
      skills: ['darts'],
      onSiteMinutes: 40,
      playsEvery: 20_000,
    },
  ],
  other: [
    {
      name: 'Quarterly coin mech clean',
      tasks: ['Clean the coin mechs and the coin path', 'Clean the bill acceptor sensors'],
      skills: ['bill-acceptors'],
      onSiteMinutes: 30,
      rule: 'FREQ=MONTHLY;INTERVAL=3;BYDAY=3WE',
    },
  ],
};

/** Plays a day at an average bar, by kind. */
const dailyPlays: Record<ModelKind, [number, number]> = {
  pinball: [35, 75],
  video: [20, 55],
  jukebox: [40, 115],
  darts: [55, 130],
  other: [15, 45],
};

interface Plan extends PlanShape {
  id: string;
  /** The rule's occurrences over the company's history and the next weeks (ms). */
  occurrences: number[];
}

interface CareModel {
  id: string;
  kind: ModelKind;
  year: number;
}

/** A smooth meter: busier in winter (peak mid-January), never running backwards. */
interface Meter {
  kind: MeterKind;
  rollsOverAt: number;
  base: number;
  perDay: number;
}

const SEASON = 0.2;
const YEAR_DAYS = 365.25;
/** The running total at `at`: the integral of perDay × (1 + SEASON·cos(2π(day − 15)/365.25)) from the epoch. */
function totalAt(m: Meter, at: number): number {
  const days = at / DAY;
  const phase = (2 * Math.PI * (days - 15)) / YEAR_DAYS;
  return Math.floor(m.base + m.perDay * (days + ((SEASON * YEAR_DAYS) / (2 * Math.PI)) * Math.sin(phase)));
}
/** The first moment the meter has counted `count` more than at `after` (to within an hour). */
function momentCounted(m: Meter, after: number, count: number): number {
  const target = totalAt(m, after) + count;
  let lo = after;
  let hi = after + ((count / m.perDay) * DAY) / (1 - SEASON) + DAY;
  while (hi - lo > HOUR) {
    const mid = (lo + hi) / 2;
    if (totalAt(m, mid) >= target) hi = mid;
    else lo = mid;
  }
  return hi;
}

/** A work order as COPY writes it. */
type OrderRow = Record<ScaleTables['workOrders']['columns'][number], unknown> & {
  id: string;
  due_at: Date;
  technician_id: string | null;
  planned_on: string | null;
};

interface OpenOrder {
  row: OrderRow;
  venueId: string;
  skills: readonly string[];
}

export class CompanyCare {
  private readonly plansByModel = new Map<string, Plan[]>();
  private readonly open: OpenOrder[] = [];
  private readonly venuesSeen = new Set<string>();
  private readonly readingDays: number;

  constructor(
    private readonly ctx: CareContext,
    private readonly company: CareCompany,
    models: readonly CareModel[],
    private readonly stock: CompanyStock,
  ) {
    const { tables: t, dice, now } = ctx;
    this.readingDays = company.largest ? 182 : 56;
    // The largest company keeps a plan on every model (about 40); a small one on a few.
    const covered = company.largest ? models : models.slice(0, dice.int(1, Math.min(3, models.length)));
    for (const model of covered) {
      const shapes = plansByKind[model.kind];
      const chosen = company.largest && model.kind === 'pinball' ? shapes.slice(0, 1 + (models.indexOf(model) % 2)) : [dice.pick(shapes)];
      const plans = chosen.map((shape) => {
        const id = dice.uuid();
        const ruleStart = shape.rule ? wallStart(company.start, company.timeZone) : null;
        const occurrences = shape.rule
          ? occurrencesBetween(
              shape.rule,
              { start: ruleStart!, timeZone: company.timeZone },
              new Date(company.start),
              new Date(now + 60 * DAY),
            ).map((o) => o.at.getTime())
          : [];
        const usual = company.technicians.find((tech) => shape.skills.every((s) => tech.skills.includes(s)));
        t.carePlans.add({
          tenant_id: company.tenantId,
          id,
          name: shape.name,
          scope: 'model',
          model_id: model.id,
          tasks: shape.tasks,
          skills: textArray(shape.skills),
          on_site_minutes: shape.onSiteMinutes,
          rule: shape.rule ?? null,
          rule_start: ruleStart,
          plays_every: shape.playsEvery ?? null,
          hours_every: shape.hoursEvery ?? null,
          lead_days: 7,
          technician_id: usual && dice.chance(0.5) ? usual.id : null,
          next_check_at: new Date(now + dice.int(1, 48) * HOUR),
          created_at: new Date(company.start),
          updated_at: new Date(company.start),
        });
        return { ...shape, id, occurrences };
      });
      this.plansByModel.set(model.id, plans);
    }
  }

  /** A game's meters and readings, and the work its model's plans made on it. */
  fitGame(game: { id: string; model: CareModel; venueId: string | null; installedAt: number; retiredAt: number | null }): void {
    const { tables: t, dice, now } = this.ctx;
    const [low, high] = dailyPlays[game.model.kind];
    const perDay = low + dice.float() * (high - low);
    const plays: Meter = {
      kind: 'plays',
      rollsOverAt: game.model.year < 2000 ? 1_000_000 : 10_000_000,
      base: dice.int(0, 900_000),
      perDay,
    };
    const second: Meter =
      game.model.kind === 'pinball'
        ? { kind: 'hours', rollsOverAt: 1_000_000, base: dice.int(0, 40_000), perDay: 10 + dice.float() * 3 }
        : { kind: 'coins_in', rollsOverAt: 1_000_000, base: dice.int(0, 900_000), perDay: perDay * 4 };
    for (const m of [plays, second])
      t.gameMeters.add({ tenant_id: this.company.tenantId, game_id: game.id, meter: m.kind, rolls_over_at: m.rollsOverAt });
    const end = game.retiredAt ?? now;
    if (game.venueId) {
      // A collection about weekly, in the afternoon, reads the plays; the second meter is written down every other time.
      const technician = dice.pick(this.company.technicians);
      const previous = { plays: -1, second: -1 };
      let visit = 0;
      for (
        let at = Math.max(game.installedAt, now - this.readingDays * DAY) + dice.int(0, 6) * DAY;
        at < end - HOUR;
        at += dice.int(6, 8) * DAY
      ) {
        previous.plays = this.reading(game.id, plays, at, 'collection', null, technician.id, previous.plays);
        if (visit++ % 2 === 0) previous.second = this.reading(game.id, second, at, 'collection', null, technician.id, previous.second);
      }
      this.venuesSeen.add(game.venueId);
    }
    if (!game.venueId || game.retiredAt !== null) return;

    for (const plan of this.plansByModel.get(game.model.id) ?? []) {
      const able = this.company.technicians.filter((tech) => plan.skills.every((s) => tech.skills.includes(s)));
      if (able.length === 0) continue;
      const doer = dice.pick(able).id;
      const meter = plan.playsEvery ? plays : plan.hoursEvery && second.kind === 'hours' ? second : null;
      const every = plan.playsEvery ?? plan.hoursEvery ?? 0;
      let last = Math.max(this.company.start, game.installedAt);
      let lastDone: { row: OrderRow; at: number } | null = null;
      for (let guard = 0; guard < 200; guard++) {
        const candidates: [number, DueReason][] = [];
        const next = plan.occurrences.find((at) => at > last + DAY);
        if (next !== undefined) candidates.push([next, 'calendar']);
        if (meter && every) candidates.push([momentCounted(meter, last, every), meter.kind === 'plays' ? 'plays' : 'hours']);
        if (candidates.length === 0) break;
        const [dueAt, reason] = candidates.sort((a, b) => a[0] - b[0])[0]!;
        if (dueAt > now + 7 * DAY) break;
        const row = this.orderRow(plan, game.id, dueAt, reason);
        if (dueAt > now - 2 * DAY) {
          if (lastDone) this.writeDone(lastDone.row, lastDone.at, plan, game.id, doer, plays, second);
          this.open.push({ row, venueId: game.venueId, skills: plan.skills });
          lastDone = null;
          break;
        }
        if (dice.chance(0.05)) {
          const closed = Math.min(dueAt + dice.float() * 3 * DAY, now - HOUR);
          t.workOrders.add({
            ...row,
            state: 'skipped',
            skip_reason: dice.pick(skipReasons),
            closed_at: new Date(closed),
            closed_by: doer,
            updated_at: new Date(closed),
            version: 2,
          });
          last = dueAt;
          continue;
        }
        const doneAt = Math.min(dueAt + (dice.float() * 8 - 3) * DAY, now - HOUR);
        // The last done one may yet turn out to have slipped (written at the end, open, when it did).
        if (lastDone) this.writeDone(lastDone.row, lastDone.at, plan, game.id, doer, plays, second);
        lastDone = { row, at: doneAt };
        last = doneAt;
      }
      if (lastDone) {
        if (lastDone.row.due_at.getTime() > now - 60 * DAY && dice.chance(OVERDUE_SHARE))
          this.open.push({ row: lastDone.row, venueId: game.venueId, skills: plan.skills });
        else this.writeDone(lastDone.row, lastDone.at, plan, game.id, doer, plays, second);
      }
    }
  }

  private orderRow(plan: Plan, gameId: string, dueAt: number, reason: DueReason): OrderRow {
    return {
      tenant_id: this.company.tenantId,
      id: this.ctx.dice.uuid(),
      care_plan_id: plan.id,
      game_id: gameId,
      due_at: new Date(dueAt),
      due_reason: reason,
      title: plan.name,
      tasks: plan.tasks,
      skills: textArray(plan.skills),
      on_site_minutes: plan.onSiteMinutes,
      state: 'open',
      technician_id: null as string | null,
      planned_on: null as string | null,
      note: '',
      skip_reason: null,
      labour_minutes: null,
      plays_at_done: null,
      hours_at_done: null,
      closed_at: null,
      closed_by: null,
      version: 1,
      created_at: new Date(dueAt - 7 * DAY),
      updated_at: new Date(dueAt - 7 * DAY),
    };
  }

  private writeDone(row: OrderRow, at: number, plan: Plan, gameId: string, doer: string, plays: Meter, second: Meter) {
    const { tables: t, dice } = this.ctx;
    const labour = Math.max(10, Math.round((plan.onSiteMinutes * (0.7 + dice.float() * 0.7)) / 5) * 5);
    const hours = second.kind === 'hours' ? second : null;
    t.workOrders.add({
      ...row,
      state: 'done',
      technician_id: doer,
      labour_minutes: labour,
      plays_at_done: totalAt(plays, at) % plays.rollsOverAt,
      hours_at_done: hours ? totalAt(hours, at) % hours.rollsOverAt : null,
      closed_at: new Date(at),
      closed_by: doer,
      updated_at: new Date(at),
      version: 2,
    });
    this.reading(gameId, plays, at, 'work_order', row.id, doer, -1);
    this.stock.workOrderDone({ id: row.id, gameId, title: plan.name, technicianId: doer, at, labourMinutes: labour });
  }

  /** Writes one reading; returns what the meter showed (a lower one than `previous` is the meter rolling over). */
  private reading(gameId: string, m: Meter, at: number, source: string, workOrderId: string | null, by: string, previous: number): number {
    const shown = totalAt(m, at) % m.rollsOverAt;
    this.ctx.tables.meterReadings.add({
      tenant_id: this.company.tenantId,
      id: this.ctx.dice.uuid(),
      game_id: gameId,
      meter: m.kind,
      reading: shown,
      rolled_over: previous >= 0 && shown < previous,
      source,
      work_order_id: workOrderId,
      read_at: new Date(at),
      read_by: by,
    });
    return shown;
  }

  /** Plans the open work into technicians' next days (overdue first, a venue's work on one day), some left to plan; route-day rows. */
  finish(): void {
    const { tables: t, dice, now } = this.ctx;
    const wall = wallTimeAt(now, this.company.timeZone);
    const today = epochDayFromParts(wall.year, wall.month, wall.day);
    const days = Array.from({ length: PLAN_DAYS }, (_, d) => formatPlainDate(today + d));
    const load = new Map(this.company.technicians.map((tech) => [tech.id, Array.from({ length: PLAN_DAYS }, () => new Set<string>())]));
    this.open.sort((a, b) => a.row.due_at.getTime() - b.row.due_at.getTime());
    for (const order of this.open) {
      const able = this.company.technicians.filter((tech) => order.skills.every((s) => tech.skills.includes(s)));
      if (able.length && !dice.chance(0.2)) {
        const tech = able.reduce((best, tech) => (dayCount(load.get(tech.id)!) < dayCount(load.get(best.id)!) ? tech : best));
        const planned = load.get(tech.id)!;
        const day = planned.findIndex((venues) => venues.has(order.venueId) || venues.size < 6);
        order.row.technician_id = tech.id;
        if (day >= 0) {
          order.row.planned_on = days[day]!;
          planned[day]!.add(order.venueId);
        }
      }
      t.workOrders.add(order.row);
    }
    // Route days a dispatcher reordered: a share of the coming days with stops, and of the last weeks'.
    const venues = [...this.venuesSeen];
    for (const tech of this.company.technicians) {
      const planned = load.get(tech.id)!;
      for (let d = -30; d < PLAN_DAYS; d++) {
        const stops = d >= 0 ? [...planned[d]!] : venues.length ? Array.from({ length: dice.int(3, 7) }, () => dice.pick(venues)) : [];
        if (new Set(stops).size < 2 || !dice.chance(d >= 0 ? 0.3 : 0.15)) continue;
        t.routeDays.add({
          tenant_id: this.company.tenantId,
          technician_id: tech.id,
          day: formatPlainDate(today + d),
          stop_order: textArray([...new Set(stops)].reverse()),
          version: dice.int(2, 6),
          updated_at: new Date(now - Math.max(1, -d) * DAY),
          updated_by: this.company.dispatcherId,
        });
      }
    }
  }
}

const dayCount = (days: Set<string>[]) => days.reduce((sum, d) => sum + d.size, 0);

/** A rule's first local start: 10 am on the company's first day. */
function wallStart(start: number, timeZone: string): string {
  const wall = wallTimeAt(start, timeZone);
  return `${formatPlainDate(epochDayFromParts(wall.year, wall.month, wall.day))}T10:00`;
}
