// Liveness with the database (GET /api/health); while the database is down it answers 503 problem details.
import { z } from 'zod';

export const health = z.strictObject({ status: z.literal('ok'), db: z.literal('ok') });
export type Health = z.infer<typeof health>;
