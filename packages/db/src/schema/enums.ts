import { pgEnum } from 'drizzle-orm/pg-core';

export const memberRole = pgEnum('member_role', ['owner', 'dispatcher', 'technician', 'venue_contact']);
export const gameKind = pgEnum('game_kind', ['pinball', 'video', 'jukebox', 'darts', 'other']);
// Our own status words: running, needs attention (playable with a fault), down, at the shop.
export const gameStatus = pgEnum('game_status', ['running', 'attention', 'down', 'in_shop']);
