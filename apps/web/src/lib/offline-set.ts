// Which answers the phone keeps for working without signal: who is signed in, the technician's own day, what its
// stops need (the venue's games, each game's boards and parts lists, the work orders and calls on the day) and the
// van's stock. Nothing else is written to the device — not the office's lists, not another technician's day.
// Keys are matched by prefix; each prefix is the one its api/<resource>.ts file builds.

const OFFLINE_PREFIXES: readonly (readonly string[])[] = [
  ['me'],
  ['route-days', 'my-day'],
  ['games', 'detail'],
  ['boards', 'game'],
  ['parts-lists', 'board'],
  ['work-orders', 'detail'],
  ['calls', 'detail'],
  ['meters', 'latest'],
  ['stock', 'my-van'],
  ['parts-used'],
];

/** The venue's games on a stop: a game list narrowed to one venue (never the company's whole list). */
function isVenueGameList(key: readonly unknown[]): boolean {
  const q = key[2];
  return (
    key[0] === 'games' &&
    key[1] === 'list' &&
    typeof q === 'object' &&
    q !== null &&
    typeof (q as { venueId?: unknown }).venueId === 'string'
  );
}

export function isOfflineQueryKey(key: readonly unknown[]): boolean {
  if (isVenueGameList(key)) return true;
  return OFFLINE_PREFIXES.some((prefix) => prefix.every((part, i) => key[i] === part));
}

/** The prefixes, for giving those queries a long cache life (a kept answer must not be dropped after 5 minutes). */
export const offlineKeyPrefixes = OFFLINE_PREFIXES;
