// The demo company's bench: models' boards and parts lists first, then what is built on them.
import type { Tx } from '../client.ts';
import { seedPartsLists } from './parts-lists.ts';
import { seedBoards } from './boards.ts';
import { seedBenchTemplates } from './bench-templates.ts';

/** What the demo seed has made by the time the bench is seeded. */
export interface BenchSeedContext {
  tenantId: string;
  games: { id: string; venueId: string | null; status: string; installedOn: string | null }[];
  technicianIds: string[];
}

export async function seedBench(tx: Tx, demo: BenchSeedContext): Promise<void> {
  const boardIds = await seedPartsLists(tx, demo.tenantId);
  // Boards fitted in the games, their cabinets' temperatures and earlier overhauls' readings.
  const fitted = await seedBoards(tx, { tenantId: demo.tenantId, boardIds, technicianIds: demo.technicianIds });
  // Bench-job templates, and a job left part-way on one of those boards.
  await seedBenchTemplates(tx, { tenantId: demo.tenantId, fitted, technicianIds: demo.technicianIds });
}
