// The demo company's care plans in plain trade terms, and a year of the work orders they made: done ones (labour
// and the meters at done), a few skipped with a reason, and open ones — overdue or due soon — planned into the
// technicians' route days (route-days.ts). Due moments come from the domain's own schedule code: the plan's
// RFC 5545 rule, plays or power-on hours counted on the game's modelled meters (meters.ts), whichever first.
import { and, asc, eq, inArray } from 'drizzle-orm';
import { occurrencesBetween } from '@bumperline/domain/schedules/recurrence';
import type { DueReason } from '@bumperline/contracts/care-vocabulary';
import type { Tx } from '../client.ts';
import {
  benchTemplates,
  boardInstances,
  carePlans,
  gameModels,
  games,
  modelBoards,
  technicianProfiles,
  users,
  workOrders,
} from '../schema/index.ts';
import { powerSupplyRecapTemplate } from './bench-templates.ts';
import { demoCompany } from './scenario.ts';
import {
  METER_HISTORY_DAYS,
  momentCounted,
  planMeters,
  seedMeters,
  shown,
  totalAt,
  type DemoGameMeters,
  type MeterGame,
} from './meters.ts';
import { planRouteDays, type DemoTechnician } from './route-days.ts';

const HOUR = 3600_000;
const DAY = 24 * HOUR;
/** Work orders go back this far. */
const HISTORY_DAYS = 365;
/** Share of plan-and-game pairs whose last due work was not done yet. */
const OVERDUE_SHARE = 0.12;

/** A demo care plan; `model` names the demo model whose games it covers. */
export interface DemoCarePlan {
  name: string;
  model: string;
  tasks: string[];
  skills: string[];
  onSiteMinutes: number;
  rule?: { rule: string; start: string };
  playsEvery?: number;
  hoursEvery?: number;
  byCapacitorLife?: boolean;
  /** The bench-job template it opens, by name. */
  template?: string;
  /** The usual technician, by e-mail. */
  technician: string;
}

export const demoCarePlans: readonly DemoCarePlan[] = [
  {
    name: 'Monthly playfield clean and rubber check',
    model: 'Comet Carnival',
    tasks: [
      'Clean the playfield and wax it',
      'Check every rubber ring for cracks; replace worn ones',
      'Clean the balls; replace any that are pitted',
      'Check the flipper bushings and coil stops for play',
      'Run the switch test',
    ],
    skills: ['pinball'],
    onSiteMinutes: 45,
    // The last Tuesday of the month, or every 3,000 plays on a busy game, whichever comes first.
    rule: { rule: 'FREQ=MONTHLY;BYDAY=-1TU', start: '2025-01-28T10:00' },
    playsEvery: 3_000,
    technician: 'tech1@lakeshore.example',
  },
  {
    name: 'Flipper rebuild',
    model: 'Midnight Rodeo',
    tasks: [
      'Replace the coil sleeves and plungers',
      'Replace the coil stops',
      'Check the end-of-stroke switches',
      'Set the flipper alignment and test the power',
    ],
    skills: ['pinball'],
    onSiteMinutes: 75,
    playsEvery: 8_000,
    technician: 'tech2@lakeshore.example',
  },
  {
    name: 'Quarterly coin mech clean',
    model: 'Alley Brawler II',
    tasks: [
      'Clean the coin mechs and the coin path',
      'Test each mech with good and bad coins',
      'Check the coin counter steps once per coin',
      'Clean the bill acceptor sensors',
    ],
    skills: ['video'],
    onSiteMinutes: 30,
    // Every three months on the third Wednesday.
    rule: { rule: 'FREQ=MONTHLY;INTERVAL=3;BYDAY=3WE', start: '2025-01-15T10:00' },
    technician: 'tech2@lakeshore.example',
  },
  {
    name: 'Jukebox yearly service',
    model: 'Wallbox 120',
    tasks: [
      'Clean and test every selector button',
      'Replace the drive belt if it is glazed or cracked',
      'Check the amplifier outputs and the speaker wiring',
      'Clean the coin path and the bill acceptor',
      'Vacuum the cabinet and the fan filter',
    ],
    skills: ['jukebox'],
    onSiteMinutes: 90,
    rule: { rule: 'FREQ=YEARLY', start: '2025-02-03T10:00' },
    technician: 'tech3@lakeshore.example',
  },
  {
    name: 'Dartboard segment check every 20,000 plays',
    model: 'Cricket Pro 9',
    tasks: [
      'Run the segment test: every segment must register',
      'Replace worn or cracked segments',
      'Clear broken tips out of the holes',
      'Check the board height and the throw line',
    ],
    skills: ['darts'],
    onSiteMinutes: 40,
    playsEvery: 20_000,
    technician: 'tech3@lakeshore.example',
  },
  {
    name: 'Fan and playfield lamp check every 1,500 power-on hours',
    model: 'Deep Sea Salvage',
    tasks: ['Clean the cabinet fan and the vents', 'Replace dead playfield lamps', 'Read the power supply outputs under load'],
    skills: ['pinball'],
    onSiteMinutes: 35,
    hoursEvery: 1_500,
    technician: 'tech2@lakeshore.example',
  },
  {
    name: 'Power supply recap when the capacitors near end of life',
    model: 'Comet Carnival',
    tasks: [],
    skills: ['power-supply', 'recap'],
    onSiteMinutes: 180,
    byCapacitorLife: true,
    template: powerSupplyRecapTemplate.name,
    technician: 'tech1@lakeshore.example',
  },
];

const skipReasons = [
  'Venue closed for a private event.',
  'Game was off waiting for a part on a service call.',
  'Manager asked us to come back next week.',
  'No access: the back room was locked.',
];

type WorkOrderRow = typeof workOrders.$inferInsert & { id: string };

interface CareGame extends MeterGame {
  model: string;
}

/** One plan's work on one game, oldest first; the last may be open. */
export interface PlanGameWork {
  plan: DemoCarePlan & { id: string; technicianId: string | null };
  game: CareGame;
  orders: WorkOrderRow[];
  /** Turns its last done work order, if due within `withinDays`, into one still open (overdue); false when it has none to turn. */
  makeOverdue(withinDays?: number): boolean;
}

export async function seedCarePlans(
  tx: Tx,
  p: { tenantId: string; now: Date; rand: () => number },
): Promise<{ doneWorkOrders: DoneWorkOrder[] }> {
  const now = p.now.getTime();
  const { tenantId, rand } = p;
  const meterFrom = Math.floor(now / DAY) * DAY - (METER_HISTORY_DAYS - 1) * DAY;
  const historyFrom = now - HISTORY_DAYS * DAY;

  const gameRows = await tx
    .select({
      id: games.id,
      model: gameModels.title,
      kind: gameModels.kind,
      modelYear: gameModels.year,
      venueId: games.venueId,
      status: games.status,
      installedOn: games.installedOn,
      pricePerPlayCents: games.pricePerPlayCents,
      modelId: games.modelId,
    })
    .from(games)
    .innerJoin(gameModels, and(eq(gameModels.tenantId, games.tenantId), eq(gameModels.id, games.modelId)))
    .where(eq(games.tenantId, tenantId))
    .orderBy(asc(games.serial));
  const careGames: CareGame[] = gameRows.map((g) => ({ ...g, modelYear: g.modelYear ?? 2000 }));
  const meters = planMeters(careGames, meterFrom, rand);

  const techRows = await tx
    .select({ id: users.id, email: users.email, skills: technicianProfiles.skills })
    .from(technicianProfiles)
    .innerJoin(users, eq(users.id, technicianProfiles.userId))
    .where(eq(technicianProfiles.tenantId, tenantId))
    .orderBy(asc(users.email));
  const technicians: DemoTechnician[] = techRows.map((t) => ({ id: t.id, email: t.email, skills: t.skills }));
  const techByEmail = new Map(technicians.map((t) => [t.email, t]));

  const [recapTemplate] = await tx
    .select({ id: benchTemplates.id })
    .from(benchTemplates)
    .where(and(eq(benchTemplates.tenantId, tenantId), eq(benchTemplates.name, powerSupplyRecapTemplate.name)));
  const modelIds = new Map(gameRows.map((g) => [g.model, g.modelId]));

  const planRows = demoCarePlans.map((plan) => ({
    ...plan,
    id: crypto.randomUUID(),
    technicianId: techByEmail.get(plan.technician)?.id ?? null,
  }));
  await tx.insert(carePlans).values(
    planRows.map((plan) => ({
      tenantId,
      id: plan.id,
      name: plan.name,
      scope: 'model' as const,
      modelId: modelIds.get(plan.model)!,
      tasks: plan.tasks,
      benchTemplateId: plan.template ? (recapTemplate?.id ?? null) : null,
      skills: plan.skills,
      onSiteMinutes: plan.onSiteMinutes,
      rule: plan.rule?.rule ?? null,
      ruleStart: plan.rule?.start ?? null,
      playsEvery: plan.playsEvery ?? null,
      hoursEvery: plan.hoursEvery ?? null,
      byCapacitorLife: plan.byCapacitorLife ?? false,
      technicianId: plan.technicianId,
      createdAt: new Date(historyFrom - 30 * DAY),
      updatedAt: new Date(historyFrom - 30 * DAY),
    })),
  );

  const works: PlanGameWork[] = [];
  for (const plan of planRows) {
    const occurrences = plan.rule
      ? occurrencesBetween(
          plan.rule.rule,
          { start: plan.rule.start, timeZone: demoCompany.timeZone },
          new Date(historyFrom),
          new Date(now + 400 * DAY),
        ).map((o) => o.at.getTime())
      : [];
    const planGames = careGames.filter((g) => g.model === plan.model && g.venueId !== null);
    if (plan.byCapacitorLife) {
      works.push(...(await capacitorLifeWork(tx, tenantId, plan, planGames, recapTemplate?.id ?? null, now)));
      continue;
    }
    for (const game of planGames) {
      works.push(
        planGameHistory(plan, game, meters.get(game.id)!, occurrences, { tenantId, now, historyFrom, meterFrom, rand, technicians }),
      );
    }
  }
  // A share of pairs let their last due work slip: it is still open, overdue.
  for (const work of works) if (rand() < OVERDUE_SHARE) work.makeOverdue();

  await planRouteDays(tx, { tenantId, now, works, technicians, rand });

  const orders = works.flatMap((w) => w.orders);
  for (let i = 0; i < orders.length; i += 500) await tx.insert(workOrders).values(orders.slice(i, i + 500));

  const done = works.flatMap((w) => w.orders.filter((o) => o.state === 'done').map((o) => ({ order: o, game: w.game })));
  await seedMeters(tx, {
    tenantId,
    games: careGames,
    plans: meters,
    from: meterFrom,
    now,
    technicianIds: technicians.map((t) => t.id),
    workOrderReadings: done
      .filter(({ order }) => order.playsAtDone !== null || order.hoursAtDone !== null)
      .map(({ order }) => ({ gameId: order.gameId, workOrderId: order.id, at: order.closedAt!.getTime(), by: order.closedBy ?? null })),
    rand,
  });
  return {
    doneWorkOrders: done.map(({ order, game }) => ({
      id: order.id,
      gameId: order.gameId,
      venueId: game.venueId,
      model: game.model,
      title: order.title,
      technicianId: order.closedBy ?? null,
      closedAt: order.closedAt!,
      labourMinutes: order.labourMinutes ?? 0,
    })),
  };
}

/** A done work order, for the parts used on it and its keep cost (stock.ts). */
export interface DoneWorkOrder {
  id: string;
  gameId: string;
  venueId: string | null;
  model: string;
  title: string;
  technicianId: string | null;
  closedAt: Date;
  labourMinutes: number;
}

/** A year of one plan on one game: each time it fell due, done (or now and then skipped), and the next one open if near. */
function planGameHistory(
  plan: PlanGameWork['plan'],
  game: CareGame,
  meters: DemoGameMeters,
  occurrences: number[],
  c: { tenantId: string; now: number; historyFrom: number; meterFrom: number; rand: () => number; technicians: DemoTechnician[] },
): PlanGameWork {
  const { rand, now } = c;
  const plays = meters.meters.find((m) => m.meter === 'plays');
  const hours = meters.meters.find((m) => m.meter === 'hours');
  const installed = game.installedOn ? Date.parse(game.installedOn) : c.historyFrom;
  // The plan started counting on this game a while before the history shown.
  let last = Math.max(c.historyFrom - rand() * 30 * DAY, installed);
  const orders: WorkOrderRow[] = [];
  const doer = plan.technicianId ?? c.technicians[0]?.id ?? null;
  const base = (dueAt: number, reason: DueReason): WorkOrderRow => ({
    tenantId: c.tenantId,
    id: crypto.randomUUID(),
    carePlanId: plan.id,
    gameId: game.id,
    dueAt: new Date(dueAt),
    dueReason: reason,
    title: plan.name,
    tasks: plan.tasks,
    skills: plan.skills,
    onSiteMinutes: plan.onSiteMinutes,
    state: 'open',
    createdAt: new Date(dueAt - 7 * DAY),
    updatedAt: new Date(dueAt - 7 * DAY),
  });
  for (let guard = 0; guard < 60; guard++) {
    const candidates: [number, DueReason][] = [];
    const next = occurrences.find((at) => at > last + DAY);
    if (next !== undefined) candidates.push([next, 'calendar']);
    if (plan.playsEvery && plays) candidates.push([momentCounted(plays, c.meterFrom, last, plan.playsEvery), 'plays']);
    if (plan.hoursEvery && hours) candidates.push([momentCounted(hours, c.meterFrom, last, plan.hoursEvery), 'hours']);
    if (candidates.length === 0) break;
    const [dueAt, reason] = candidates.sort((a, b) => a[0] - b[0])[0]!;
    // Not due within the lead yet: the scheduled run has not made its work order.
    if (dueAt > now + 7 * DAY) break;
    if (dueAt > now - 2 * DAY) {
      orders.push(base(dueAt, reason));
      break;
    }
    const order = base(dueAt, reason);
    if (rand() < 0.07) {
      const closed = Math.min(dueAt + rand() * 3 * DAY, now - HOUR);
      orders.push({
        ...order,
        state: 'skipped',
        skipReason: skipReasons[Math.floor(rand() * skipReasons.length)]!,
        closedAt: new Date(closed),
        closedBy: doer,
        updatedAt: new Date(closed),
      });
      last = dueAt;
      continue;
    }
    // Done around the due day, in the afternoon; a little more or less time than planned on site.
    const doneAt = Math.min(Math.floor((dueAt + (rand() * 8 - 3) * DAY) / DAY) * DAY + 19 * HOUR + rand() * 4 * HOUR, now - HOUR);
    const labour = Math.max(10, Math.round((plan.onSiteMinutes * (0.7 + rand() * 0.7)) / 5) * 5);
    orders.push({
      ...order,
      state: 'done',
      labourMinutes: labour,
      playsAtDone: plays ? shown(plays, totalAt(plays, c.meterFrom, doneAt)) : null,
      hoursAtDone: hours ? shown(hours, totalAt(hours, c.meterFrom, doneAt)) : null,
      note: rand() < 0.2 ? 'All good; nothing else to report.' : '',
      closedAt: new Date(doneAt),
      closedBy: doer,
      updatedAt: new Date(doneAt),
      version: 2,
    });
    last = doneAt;
  }
  return {
    plan,
    game,
    orders,
    makeOverdue(withinDays = 45) {
      if (orders.some((o) => o.state === 'open')) {
        // A due-soon one is dropped: the one before it is the open one now.
        if (orders.length < 2) return false;
        orders.pop();
      }
      const lastOrder = orders[orders.length - 1];
      if (!lastOrder || lastOrder.state !== 'done' || lastOrder.dueAt!.getTime() < now - withinDays * DAY) return false;
      orders[orders.length - 1] = {
        ...lastOrder,
        state: 'open',
        labourMinutes: null,
        playsAtDone: null,
        hoursAtDone: null,
        note: '',
        closedAt: null,
        closedBy: null,
        version: 1,
        updatedAt: lastOrder.createdAt,
      };
      return true;
    },
  };
}

/** Recap work for the games whose power supply was never recapped or was recapped long ago. */
async function capacitorLifeWork(
  tx: Tx,
  tenantId: string,
  plan: PlanGameWork['plan'],
  planGames: CareGame[],
  templateId: string | null,
  now: number,
): Promise<PlanGameWork[]> {
  if (planGames.length === 0) return [];
  const boards = await tx
    .select({ gameId: boardInstances.gameId, lastRecapOn: boardInstances.lastRecapOn })
    .from(boardInstances)
    .innerJoin(modelBoards, and(eq(modelBoards.tenantId, boardInstances.tenantId), eq(modelBoards.id, boardInstances.boardId)))
    .where(
      and(
        eq(boardInstances.tenantId, tenantId),
        eq(modelBoards.name, 'Power supply'),
        inArray(
          boardInstances.gameId,
          planGames.map((g) => g.id),
        ),
      ),
    );
  // The supplies recapped longest ago (or never) are the ones whose capacitors near the end of their life.
  const old = [...boards].sort((a, b) => (a.lastRecapOn ?? '').localeCompare(b.lastRecapOn ?? '')).slice(0, 3);
  return old.map((b, i) => {
    const game = planGames.find((g) => g.id === b.gameId)!;
    const dueAt = now - (20 - i * 12) * DAY;
    const order: WorkOrderRow = {
      tenantId,
      id: crypto.randomUUID(),
      carePlanId: plan.id,
      gameId: game.id,
      dueAt: new Date(dueAt),
      dueReason: 'capacitor_life',
      title: plan.name,
      tasks: [],
      benchTemplateId: templateId,
      skills: plan.skills,
      onSiteMinutes: plan.onSiteMinutes,
      state: 'open',
      createdAt: new Date(dueAt - 30 * DAY),
      updatedAt: new Date(dueAt - 30 * DAY),
    };
    return { plan, game, orders: [order], makeOverdue: () => false };
  });
}
