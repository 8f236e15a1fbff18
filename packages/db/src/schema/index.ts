// The whole schema, for drizzle-kit and for typed queries.
export * from './enums.ts';
export * from './identity.ts';
export * from './tenants.ts';
export * from './team.ts';
export * from './venues.ts';
export * from './games.ts';
export * from './audit.ts';
export * from './calls.ts';
export * from './settings.ts';
export * from './technicians.ts';
export * from './messaging.ts';
export * from './parts-lists.ts';
export * from './boards.ts';
export * from './bench-jobs.ts';
export * from './part-readings.ts';
