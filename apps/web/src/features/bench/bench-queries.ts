// What the bench screens ask for, said once: the pages' hooks and the routes' prefetch use the same queries.
import type { Params } from 'react-router-dom';
import type { BenchJobListQuery } from '@bumperline/contracts/bench-jobs';
import { can, type Role } from '@bumperline/contracts/roles';
import { benchJobListQuery, benchJobQuery } from '../../api/bench-jobs.ts';
import { benchTemplateQuery, benchTemplatesQuery } from '../../api/bench-templates.ts';
import { boardPageQuery } from '../../api/boards.ts';
import type { FetchAhead } from '../../api/fetch-ahead.ts';

/** The bench page's open jobs (all of them: the technician's own are sorted first) and its latest finished ones. */
export const openJobsQuery: BenchJobListQuery = { state: 'in_progress', limit: 100 };
export const finishedJobsQuery: BenchJobListQuery = { state: 'finished', limit: 10 };

/** The jobs already open on a board, offered before a second one is started. */
export const openJobsOnBoardQuery = (boardInstanceId: string): BenchJobListQuery => ({
  state: 'in_progress',
  boardInstanceId,
  limit: 10,
});

export function prefetchBench(ahead: FetchAhead, role: Role) {
  if (!can(role, 'bench:read')) return;
  ahead(benchJobListQuery(openJobsQuery));
  ahead(benchJobListQuery(finishedJobsQuery));
  ahead(benchTemplatesQuery());
}

/** The job and its sheet read the same job. */
export function prefetchBenchJob(ahead: FetchAhead, role: Role, _url: URL, params: Params) {
  if (can(role, 'bench:read') && params.id) ahead(benchJobQuery(params.id));
}

export function prefetchNewBenchJob(ahead: FetchAhead, role: Role, _url: URL, params: Params) {
  const id = params.boardInstanceId;
  if (!can(role, 'bench:work') || !id) return;
  ahead(boardPageQuery(id));
  ahead(benchTemplatesQuery());
  ahead(benchJobListQuery(openJobsOnBoardQuery(id)));
}

export function prefetchBenchTemplates(ahead: FetchAhead, role: Role) {
  if (can(role, 'bench:read')) ahead(benchTemplatesQuery());
}

/** A template's page and its editor read the same template. */
export function prefetchBenchTemplate(ahead: FetchAhead, role: Role, _url: URL, params: Params) {
  if (can(role, 'bench:read') && params.id) ahead(benchTemplateQuery(params.id));
}
