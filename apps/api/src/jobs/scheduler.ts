// The scheduled jobs (node-cron): the outbox worker every 10 seconds, response-target warnings every
// minute, expired rate-limit counters cleared every 10 minutes, due care-plan work every 15 minutes (and at start-up). Each run first takes a PostgreSQL
// advisory lock, so with several API instances one runs and the others skip that tick.
import cron, { type ScheduledTask } from 'node-cron';
import type { Db } from '@bumperline/db/client';
import { tryAdvisoryXactLock } from '@bumperline/db/queries/advisory-locks';
import type { Logger } from 'pino';
import type { Mailer } from '../services/mailer.ts';
import type { SmsSender } from '../services/sms.ts';
import { runOutboxOnce } from './outbox-worker.ts';
import { runTargetWarningsOnce } from './target-warnings.ts';
import { runRateLimitCleanupOnce } from './rate-limit-cleanup.ts';
import { runCarePlansOnce } from './care-plan-run.ts';

export interface JobDeps {
  db: Db;
  sms: SmsSender;
  mailer: Mailer;
  logger: Logger;
  appOrigin: string;
  /** Cron expressions (seconds first) overriding the defaults, for tests. */
  schedules?: { outbox?: string; targetWarnings?: string; rateLimitCleanup?: string; carePlans?: string };
}

/** One advisory-lock key per job (any constant bigint; "BL" in the high bytes keeps them recognisable). */
export const JOB_LOCKS = {
  outbox: 0x424c_0001,
  targetWarnings: 0x424c_0002,
  rateLimitCleanup: 0x424c_0003,
  carePlans: 0x424c_0004,
} as const;

/**
 * Runs `fn` only if no other instance is running the same job, else skips and resolves false.
 *
 * The lock is transaction-scoped (pg_try_advisory_xact_lock), because session locks are lost behind a
 * transaction-mode pooler. The transaction that holds it does nothing else and stays open for the run,
 * on its own pooled connection; the job's work runs in its own short transactions on other connections
 * and calls providers outside any of them. So the price is one idle connection per running job, and if
 * the process dies the connection closes and the lock goes with it.
 */
export async function runExclusive<T>(db: Db, lockKey: number, fn: () => Promise<T>): Promise<{ ran: true; result: T } | { ran: false }> {
  return db.transaction(async (tx) => {
    if (!(await tryAdvisoryXactLock(tx, lockKey))) return { ran: false as const };
    return { ran: true as const, result: await fn() };
  });
}

export function startJobs(deps: JobDeps): { stop(): void } {
  const { db, logger } = deps;
  const step = (name: keyof typeof JOB_LOCKS, work: () => Promise<unknown>) => async () => {
    try {
      const outcome = await runExclusive(db, JOB_LOCKS[name], work);
      if (outcome.ran) logger.debug({ job: name, result: outcome.result }, 'job ran');
      else logger.debug({ job: name }, 'job running elsewhere; skipped');
    } catch (err) {
      // A failed run is logged and the next tick tries again; the schedule keeps going.
      logger.error({ err, job: name }, 'job failed');
    }
  };

  const carePlanRun = step('carePlans', () => runCarePlansOnce({ db, logger }));
  const tasks: ScheduledTask[] = [
    cron.schedule(
      deps.schedules?.outbox ?? '*/10 * * * * *',
      step('outbox', () => runOutboxOnce({ db, sms: deps.sms, mailer: deps.mailer, logger })),
      { name: 'outbox', noOverlap: true },
    ),
    cron.schedule(
      deps.schedules?.targetWarnings ?? '0 * * * * *',
      step('targetWarnings', () => runTargetWarningsOnce({ db, appOrigin: deps.appOrigin, logger })),
      { name: 'target-warnings', noOverlap: true },
    ),
    cron.schedule(
      deps.schedules?.rateLimitCleanup ?? '30 */10 * * * *',
      step('rateLimitCleanup', () => runRateLimitCleanupOnce({ db })),
      { name: 'rate-limit-cleanup', noOverlap: true },
    ),
    cron.schedule(deps.schedules?.carePlans ?? '0 */15 * * * *', carePlanRun, { name: 'care-plans', noOverlap: true }),
  ];
  // Once at start-up as well: due work missed while no instance ran is made up at once (the run is state-based).
  void carePlanRun();
  return {
    stop() {
      for (const task of tasks) void task.destroy();
    },
  };
}
