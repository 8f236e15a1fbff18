// Row-level security helpers. Every tenant-owned table carries tenant_id and one policy that
// compares it with the transaction-local setting app.tenant_id. A missing setting reads as ''
// after a transaction ends, so nullif(...) turns it into NULL and the comparison matches nothing.
import { sql } from 'drizzle-orm';
import { pgPolicy, type AnyPgColumn } from 'drizzle-orm/pg-core';

export const currentTenant = sql`nullif(current_setting('app.tenant_id', true), '')::uuid`;
export const currentUser = sql`nullif(current_setting('app.user_id', true), '')::uuid`;

/** The one policy on a tenant-owned table: rows of the current tenant only, for reads and writes. */
export function tenantIsolation(tenantId: AnyPgColumn) {
  return pgPolicy('tenant_isolation', {
    as: 'permissive',
    for: 'all',
    to: 'public',
    using: sql`${tenantId} = ${currentTenant}`,
    withCheck: sql`${tenantId} = ${currentTenant}`,
  });
}
