// Enumerations in the database take their values from the shared contracts, so the API, the web app
// and the schema cannot drift apart.
import { pgEnum } from 'drizzle-orm/pg-core';
import { roles } from '@bumperline/contracts/roles';
import { gameKinds, gameStatuses } from '@bumperline/contracts/games';
import { callStates, problemKinds, severities } from '@bumperline/contracts/calls';

export const memberRole = pgEnum('member_role', roles);
export const gameKind = pgEnum('game_kind', gameKinds);
export const gameStatus = pgEnum('game_status', gameStatuses);

export const problemKind = pgEnum('problem_kind', problemKinds);
export const callSeverity = pgEnum('call_severity', severities);
export const callState = pgEnum('call_state', callStates);
export const callSource = pgEnum('call_source', ['game_tag', 'venue_view', 'staff']);
export const outboxChannel = pgEnum('outbox_channel', ['sms', 'email']);
export const outboxStatus = pgEnum('outbox_status', ['pending', 'sending', 'sent', 'failed', 'blocked']);
