// The tenant rule, stated once. A tenant-owned table gets a tenant_id (its company, deleted with it)
// leading the primary key, the one tenant_isolation policy, and row-level security switched on.
// FORCE row-level security still goes in a custom migration: drizzle-kit cannot emit it.
import type { BuildExtraConfigColumns } from 'drizzle-orm';
import { pgTable, primaryKey, uuid, type AnyPgColumn, type PgColumnBuilderBase, type PgTableExtraConfigValue } from 'drizzle-orm/pg-core';
import { tenantIsolation } from './rls.ts';
import { tenants } from './tenants.ts';

function tenantIdColumn(wholeKey: boolean) {
  const column = uuid('tenant_id')
    .notNull()
    .references(() => tenants.id, { onDelete: 'cascade' });
  // Declared on the column, not as a composite key, so the schema (and its migrations) stay as they were.
  return wholeKey ? column.primaryKey() : column;
}

type WithTenant<TColumns> = { tenantId: ReturnType<typeof tenantIdColumn> } & TColumns;
type Self<TName extends string, TColumns extends Record<string, PgColumnBuilderBase>> = BuildExtraConfigColumns<
  TName,
  WithTenant<TColumns>,
  'pg'
>;

export interface TenantTableOptions<TSelf> {
  /**
   * The columns after tenant_id in the primary key; the row's own `id` when not given. 'tenant_id' makes
   * tenant_id the whole key: one row per company.
   */
  key?: ((t: TSelf) => [AnyPgColumn, ...AnyPgColumn[]]) | 'tenant_id';
}

/** pgTable for a tenant-owned table: `columns` and `extra` (indexes, foreign keys, other policies) without the tenant rule. */
export function tenantTable<TName extends string, TColumns extends Record<string, PgColumnBuilderBase>>(
  name: TName,
  columns: TColumns,
  extra: (t: Self<TName, TColumns>) => PgTableExtraConfigValue[] = () => [],
  options: TenantTableOptions<Self<TName, TColumns>> = {},
) {
  const { key } = options;
  const withTenant: WithTenant<TColumns> = { tenantId: tenantIdColumn(key === 'tenant_id'), ...columns };
  return pgTable(name, withTenant, (t) => [
    ...(key === 'tenant_id' ? [] : [primaryKey({ columns: [t.tenantId, ...(key ? key(t) : [ownId(name, t)])] })]),
    ...extra(t),
    tenantIsolation(t.tenantId),
  ]).enableRLS();
}

function ownId(name: string, t: Record<string, unknown>): AnyPgColumn {
  if (!t.id) throw new Error(`tenantTable('${name}') has no id column: say which columns key it`);
  return t.id as AnyPgColumn;
}
