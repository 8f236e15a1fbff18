// The whole schema, for drizzle-kit and for typed queries.
export * from './enums.ts';
export * from './identity.ts';
export * from './tenancy.ts';
export * from './venues.ts';
export * from './games.ts';
export * from './audit.ts';
export * from './service.ts';
