// What a venue contact sees: their venues' games with status, the calls on them, and reporting a problem.
import { z } from 'zod';
import { shortText, uuid } from './common.ts';
import { callStates, problemKinds, serviceCall } from './calls.ts';
import { gameKinds, gameStatuses } from './games.ts';

export const venueReportInput = z.strictObject({ gameId: uuid, problem: z.enum(problemKinds), note: shortText(1000).default('') });
export type VenueReportInput = z.input<typeof venueReportInput>;

/** A call as a venue contact sees it: not who is assigned, nor whether the reporter asked for texts. */
export const venueViewCall = serviceCall.omit({ technicianId: true, reporterWantsSms: true });
export type VenueViewCall = z.infer<typeof venueViewCall>;

export const venueView = z.strictObject({
  venues: z.array(z.strictObject({ id: uuid, name: z.string(), addressLine: z.string(), city: z.string() })),
  games: z.array(
    z.strictObject({
      id: uuid,
      venueId: uuid,
      serial: z.string(),
      status: z.enum(gameStatuses),
      title: z.string(),
      kind: z.enum(gameKinds),
    }),
  ),
  openCalls: z.array(venueViewCall),
  /** Closed and cancelled calls among the most recent. */
  pastCalls: z.array(venueViewCall),
});
export type VenueView = z.infer<typeof venueView>;

/** The call the report opened, or the open one it joined (`joined`). */
export const venueReportOpened = z.strictObject({ id: uuid, state: z.enum(callStates), joined: z.boolean() });
export type VenueReportOpened = z.infer<typeof venueReportOpened>;
