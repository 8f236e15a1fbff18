// Two years of service calls for the demo route: closed calls with their downtime, and open calls for
// the games that are down or need attention today. Invented, but shaped like a real route: most faults
// are fixed within a day, a few wait on parts.
import { randomBytes } from 'node:crypto';
import type { Tx } from '../client.ts';
import { callEvents, downtimeIntervals, serviceCalls } from '../schema/index.ts';

type Problem = (typeof serviceCalls.$inferInsert)['problem'];
const problems: Problem[] = ['dead', 'no_credit', 'ball_stuck', 'no_sound', 'display_out', 'other'];
const HOUR = 3600_000;

export async function seedCallHistory(
  tx: Tx,
  p: {
    tenantId: string;
    games: { id: string; venueId: string | null; status: string; installedOn: string | null }[];
    technicianIds: string[];
    rand: () => number;
    now?: Date;
  },
) {
  const now = p.now ?? new Date();
  const start = now.getTime() - 730 * 24 * HOUR;
  const calls: (typeof serviceCalls.$inferInsert)[] = [];
  const events: (typeof callEvents.$inferInsert)[] = [];
  const downtime: (typeof downtimeIntervals.$inferInsert)[] = [];
  const pick = <T>(xs: T[]) => xs[Math.floor(p.rand() * xs.length)]!;

  for (const game of p.games) {
    if (!game.venueId) continue;
    const installed = game.installedOn ? Date.parse(game.installedOn) : start;
    let t = Math.max(start, installed) + p.rand() * 60 * 24 * HOUR;
    while (t < now.getTime() - 7 * 24 * HOUR) {
      const problem = pick(problems);
      const severity = problem === 'no_sound' || problem === 'other' ? 'fault' : 'down';
      const opened = new Date(t);
      const responseHours = 1 + p.rand() * (p.rand() < 0.1 ? 72 : 20);
      const fixed = new Date(t + responseHours * HOUR);
      const closed = new Date(fixed.getTime() + 0.5 * HOUR);
      const tech = pick(p.technicianIds);
      const id = crypto.randomUUID();
      calls.push({
        tenantId: p.tenantId,
        id,
        gameId: game.id,
        venueId: game.venueId,
        problem,
        severity,
        state: 'closed',
        source: p.rand() < 0.6 ? 'game_tag' : 'staff',
        technicianId: tech,
        acceptedAt: new Date(t + 0.3 * HOUR),
        statusToken: randomBytes(18).toString('base64url'),
        openedAt: opened,
        targetAt: new Date(t + (severity === 'down' ? 4 : 24) * HOUR),
        fixedAt: fixed,
        closedAt: closed,
        updatedAt: closed,
      });
      events.push(
        { tenantId: p.tenantId, callId: id, kind: 'opened', at: opened, actorLabel: 'Reporter (game tag)', toState: 'reported' },
        {
          tenantId: p.tenantId,
          callId: id,
          kind: 'assigned',
          at: new Date(t + 0.2 * HOUR),
          actorLabel: 'Dispatch',
          fromState: 'reported',
          toState: 'assigned',
        },
        { tenantId: p.tenantId, callId: id, kind: 'state', at: fixed, actorUserId: tech, fromState: 'on_site', toState: 'fixed' },
        { tenantId: p.tenantId, callId: id, kind: 'state', at: closed, actorUserId: tech, fromState: 'fixed', toState: 'closed' },
      );
      if (severity === 'down') downtime.push({ tenantId: p.tenantId, gameId: game.id, callId: id, startedAt: opened, endedAt: fixed });
      // Time to the next failure: weeks to months (older games fail more often).
      t = fixed.getTime() + (20 + p.rand() * 160) * 24 * HOUR;
    }
    // Today's problems: games that are down or need attention have an open call.
    if (game.status === 'down' || game.status === 'attention') {
      const severity = game.status === 'down' ? 'down' : 'fault';
      const problem: Problem = severity === 'down' ? pick(['dead', 'no_credit', 'ball_stuck']) : pick(['no_sound', 'display_out', 'other']);
      // Down games were mostly reported within the last few hours; faults can wait longer.
      const opened = new Date(now.getTime() - (severity === 'down' ? 0.2 + p.rand() * 5 : 1 + p.rand() * 26) * HOUR);
      const assigned = p.rand() < 0.4;
      const id = crypto.randomUUID();
      calls.push({
        tenantId: p.tenantId,
        id,
        gameId: game.id,
        venueId: game.venueId,
        problem,
        severity,
        state: assigned ? 'assigned' : 'reported',
        source: 'game_tag',
        technicianId: assigned ? pick(p.technicianIds) : null,
        statusToken: randomBytes(18).toString('base64url'),
        openedAt: opened,
        targetAt: new Date(opened.getTime() + (severity === 'down' ? 4 : 24) * HOUR),
        note: severity === 'down' ? 'Lights on but will not start a game.' : '',
        updatedAt: opened,
      });
      events.push({ tenantId: p.tenantId, callId: id, kind: 'opened', at: opened, actorLabel: 'Reporter (game tag)', toState: 'reported' });
      if (severity === 'down') downtime.push({ tenantId: p.tenantId, gameId: game.id, callId: id, startedAt: opened, endedAt: null });
    }
  }
  for (let i = 0; i < calls.length; i += 500) await tx.insert(serviceCalls).values(calls.slice(i, i + 500));
  for (let i = 0; i < events.length; i += 500) await tx.insert(callEvents).values(events.slice(i, i + 500));
  for (let i = 0; i < downtime.length; i += 500) await tx.insert(downtimeIntervals).values(downtime.slice(i, i + 500));
}
