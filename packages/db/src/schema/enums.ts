import { pgEnum } from 'drizzle-orm/pg-core';

export const memberRole = pgEnum('member_role', ['owner', 'dispatcher', 'technician', 'venue_contact']);
export const gameKind = pgEnum('game_kind', ['pinball', 'video', 'jukebox', 'darts', 'other']);
// Our own status words: running, needs attention (playable with a fault), down, at the shop.
export const gameStatus = pgEnum('game_status', ['running', 'attention', 'down', 'in_shop']);

// Service calls: what the reporter saw, how bad it is, and where the call stands.
export const problemKind = pgEnum('problem_kind', ['dead', 'no_credit', 'ball_stuck', 'no_sound', 'display_out', 'other']);
export const callSeverity = pgEnum('call_severity', ['down', 'fault', 'cosmetic']);
export const callState = pgEnum('call_state', [
  'reported',
  'assigned',
  'on_the_way',
  'on_site',
  'waiting_parts',
  'at_shop',
  'fixed',
  'closed',
  'cancelled',
]);
export const callSource = pgEnum('call_source', ['game_tag', 'venue_view', 'staff']);
export const outboxChannel = pgEnum('outbox_channel', ['sms', 'email']);
export const outboxStatus = pgEnum('outbox_status', ['pending', 'sending', 'sent', 'failed', 'blocked']);
