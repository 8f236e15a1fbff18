// What a stop needs, fetched while there is signal so the phone holds it when there is none: the venue's games,
// each game's boards (and so its parts lists) and the day's work orders. The offline store keeps these answers
// (lib/offline-set.ts lists the same keys).
import type { QueryClient } from '@tanstack/react-query';
import { myVanQuery } from '../../api/stock.ts';
import type { RouteDay } from '@bumperline/contracts/route-days';
import { gameBoardsQuery } from '../../api/boards.ts';
import { gameListQuery } from '../../api/games.ts';
import { boardPartsListQuery } from '../../api/parts-lists.ts';
import { workOrderQuery } from '../../api/work-orders.ts';

/** The games at one venue (a stop), in one page: a venue has a handful of games, never hundreds. */
export const venueGamesQuery = (venueId: string) => gameListQuery({ venueId, limit: 100 });

export async function keepStopsOffline(qc: QueryClient, day: RouteDay): Promise<void> {
  const stops = [...day.stops, ...day.unscheduled];
  const items = stops.flatMap((s) => s.items);
  const gameIds = [...new Set(items.map((i) => i.game.id))];
  await Promise.all([
    qc.prefetchQuery(myVanQuery()),
    ...stops.map((s) => qc.prefetchQuery(venueGamesQuery(s.venue.id))),
    ...items.filter((i) => i.kind === 'work_order').map((i) => qc.prefetchQuery(workOrderQuery(i.id))),
    ...gameIds.map(async (id) => {
      const boards = await qc.fetchQuery(gameBoardsQuery(id)).catch(() => undefined);
      const boardIds = new Set([...(boards?.items.map((b) => b.boardId) ?? []), ...(boards?.modelBoards.map((b) => b.id) ?? [])]);
      await Promise.all([...boardIds].map((b) => qc.prefetchQuery(boardPartsListQuery(b))));
    }),
  ]);
}
