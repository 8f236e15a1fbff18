// The care-plan run: makes a work order for every game whose plan's work has come due (or is due within the plan's
// lead), exactly once. It is state-based — each run looks at every active plan past its next check and asks, per
// game, "is work due and is none open?" — so a run missed while the API was down is made up by the next one (and
// at start-up). The partial unique index on open work orders makes the insert happen once on any number of
// instances; the plan's next check then moves to the earliest moment one of its games may need work. Each new work
// order goes on the first of its technician's days with room for its time on site (day-capacity.ts).
import type { Logger } from 'pino';
import { withScope, type Db, type Tx } from '@bumperline/db/client';
import { listCarePlansToCheck, listGamesOfCarePlan, setCarePlanNextCheck, type CarePlanRow } from '@bumperline/db/queries/care-plans';
import { listCompaniesWithCarePlansToCheck } from '@bumperline/db/queries/due-work';
import { listTechnicians } from '@bumperline/db/queries/technicians';
import { insertWorkOrderOnce, listBookedWorkMinutes, listGamesWithOpenWorkOrder } from '@bumperline/db/queries/work-orders';
import { listRouteTechnicians } from '@bumperline/db/queries/route-days';
import { firstDayWithRoom, onSiteCapacityMinutes } from '@bumperline/domain/schedules/day-capacity';
import { formatPlainDate, parsePlainDate } from '@bumperline/domain/plain-date';
import { rankTechnicians } from '@bumperline/domain/travel/technician-ranking';
import { dueOfPlanGames } from '../services/care-due-of-games.ts';
import { companyZone } from '../services/care-plans.ts';
import { dateInZone } from '../services/company-today.ts';

export interface CarePlanRunDeps {
  db: Db;
  logger?: Logger;
}

export interface CarePlanRunResult {
  companies: number;
  plansChecked: number;
  workOrdersCreated: number;
}

const DAY = 86_400_000;
/**
 * A plan is looked at again at least this often: meter projections drift with use, capacitor ages grow and new games
 * join a model, none of which moves the plan's next check by itself.
 */
const LONGEST_CHECK_GAP = DAY;
/** The most games of one plan a run looks at (a model on thousands of games still makes progress each run). */
const GAMES_PER_PLAN = 5000;

export async function runCarePlansOnce(deps: CarePlanRunDeps, now: Date = new Date()): Promise<CarePlanRunResult> {
  const result: CarePlanRunResult = { companies: 0, plansChecked: 0, workOrdersCreated: 0 };
  for (const tenantId of await listCompaniesWithCarePlansToCheck(deps.db, { now })) {
    result.companies++;
    const { plans, created } = await withScope(deps.db, { tenantId }, (tx) => runCompany(tx, tenantId, now));
    result.plansChecked += plans;
    result.workOrdersCreated += created;
  }
  if (result.workOrdersCreated) deps.logger?.info(result, 'care-plan work orders created');
  return result;
}

async function runCompany(tx: Tx, tenantId: string, now: Date): Promise<{ plans: number; created: number }> {
  const timeZone = await companyZone(tx, tenantId);
  const plans = await listCarePlansToCheck(tx, now);
  let created = 0;
  let technicians: Awaited<ReturnType<typeof listTechnicians>> | undefined;
  let booking: DayBooking | undefined;
  for (const plan of plans) {
    const { games } = await listGamesOfCarePlan(tx, plan, GAMES_PER_PLAN);
    const open = await listGamesWithOpenWorkOrder(tx, plan.id);
    const waiting = games.filter((g) => !open.has(g.id));
    const dues = await dueOfPlanGames(
      tx,
      plan,
      waiting.map((g) => g.id),
      { now, timeZone },
    );
    let nextCheck = now.getTime() + LONGEST_CHECK_GAP;
    for (const game of waiting) {
      const due = dues.get(game.id);
      if (!due?.dueAt || !due.reason) continue;
      if (due.state === 'ok') {
        // Not due yet: look again when it enters its lead.
        nextCheck = Math.min(nextCheck, due.dueAt.getTime() - plan.leadDays * DAY);
        continue;
      }
      technicians ??= await listTechnicians(tx);
      booking ??= await dayBooking(tx, now, timeZone);
      const technicianId = plan.technicianId ?? nearestTechnician(plan, game, technicians);
      // Overdue work from today, other work from the day it falls due (the company's local dates); then the first of
      // the technician's days with room for it, so a backlog spreads over the coming days instead of piling on one.
      const earliest = dateInZone(timeZone, due.dueAt <= now ? now : due.dueAt);
      const plannedOn = technicianId ? booking.place(technicianId, earliest, plan.onSiteMinutes) : earliest;
      const id = await insertWorkOrderOnce(tx, {
        carePlanId: plan.id,
        gameId: game.id,
        dueAt: due.dueAt,
        dueReason: due.reason,
        title: plan.name,
        tasks: plan.tasks,
        benchTemplateId: plan.benchTemplateId,
        skills: plan.skills,
        onSiteMinutes: plan.onSiteMinutes,
        technicianId,
        plannedOn,
      });
      if (id) {
        created++;
        if (technicianId) booking.book(technicianId, plannedOn, plan.onSiteMinutes);
      }
    }
    await setCarePlanNextCheck(tx, plan.id, new Date(Math.max(nextCheck, now.getTime() + 60_000)));
  }
  return { plans: plans.length, created };
}

/** How far ahead new work may be spread. */
const BOOKING_HORIZON_DAYS = 14;

interface DayBooking {
  /** The first day from `earliest` with room on the technician's day for `minutes` on site. */
  place(technicianId: string, earliest: string, minutes: number): string;
  book(technicianId: string, day: string, minutes: number): void;
}

/** The time on site already booked on each technician's coming days, and what each day can hold (day-capacity.ts). */
async function dayBooking(tx: Tx, now: Date, timeZone: string): Promise<DayBooking> {
  const today = dateInZone(timeZone, now);
  const lastDay = formatPlainDate(parsePlainDate(today) + 400); // work due up to a year ahead (lead days) is placed too
  const booked = await listBookedWorkMinutes(tx, { fromDay: today, toDay: lastDay });
  const capacity = new Map(
    (await listRouteTechnicians(tx, { day: today })).map((t) => [t.id, onSiteCapacityMinutes(t.dayStart, t.dayEnd)]),
  );
  return {
    place: (technicianId, earliest, minutes) =>
      firstDayWithRoom({
        from: earliest,
        needMinutes: minutes,
        capacityMinutes: capacity.get(technicianId) ?? onSiteCapacityMinutes('08:00', '17:00'),
        booked: (day) => booked.get(`${technicianId}|${day}`) ?? 0,
        horizonDays: BOOKING_HORIZON_DAYS,
      }),
    book: (technicianId, day, minutes) => booked.set(`${technicianId}|${day}`, (booked.get(`${technicianId}|${day}`) ?? 0) + minutes),
  };
}

/** Without a usual technician: the nearest technician with the plan's skills (technician-ranking.ts); null if none. */
function nearestTechnician(
  plan: CarePlanRow,
  game: { latitude: number | null; longitude: number | null },
  technicians: Awaited<ReturnType<typeof listTechnicians>>,
): string | null {
  if (game.latitude === null || game.longitude === null) return null;
  const located = technicians.filter((t) => t.homeLatitude !== null && t.homeLongitude !== null);
  if (located.length === 0) return null;
  const ranks = rankTechnicians(
    { location: { lat: game.latitude, lon: game.longitude }, requiredSkills: plan.skills },
    located.map((t) => ({
      id: t.userId,
      location: { lat: t.homeLatitude!, lon: t.homeLongitude! },
      skills: t.skills,
      openJobs: t.openCalls,
    })),
    { missingSkill: 'exclude' },
  );
  const best = ranks.filter((r) => !r.excluded).sort((a, b) => a.distanceKm - b.distanceKm)[0];
  return best?.id ?? null;
}
