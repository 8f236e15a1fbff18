// Outgoing SMS and e-mail, and the numbers that asked for no more texts.
import { index, integer, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { outboxChannel, outboxStatus } from './enums.ts';
import { tenantTable } from './tenant-table.ts';

/**
 * Outgoing SMS and e-mail. Written in the same transaction as the change that causes them, sent by a
 * worker afterwards, retried with backoff: never lost, never sent twice.
 */
export const outbox = tenantTable(
  'outbox',
  {
    id: uuid('id').notNull().defaultRandom(),
    channel: outboxChannel.column('channel').notNull(),
    toAddress: text('to_address').notNull(),
    subject: text('subject').notNull().default(''),
    body: text('body').notNull(),
    callId: uuid('call_id'),
    status: outboxStatus.column('status').notNull().default('pending'),
    attempts: integer('attempts').notNull().default(0),
    nextAttemptAt: timestamp('next_attempt_at', { withTimezone: true }).notNull().defaultNow(),
    claimedAt: timestamp('claimed_at', { withTimezone: true }),
    lastError: text('last_error'),
    providerId: text('provider_id'),
    providerStatus: text('provider_status'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    sentAt: timestamp('sent_at', { withTimezone: true }),
  },
  (t) => [
    outboxChannel.check('outbox_channel_check', t.channel),
    outboxStatus.check('outbox_status_check', t.status),
    index('outbox_tenant_due_idx').on(t.tenantId, t.status, t.nextAttemptAt),
    index('outbox_tenant_call_idx').on(t.tenantId, t.callId),
    index('outbox_provider_idx').on(t.providerId),
  ],
);

/** Numbers that texted STOP: nothing is sent to them until they text START (carrier rules, any company). */
export const smsOptOuts = pgTable('sms_opt_outs', {
  phone: text('phone').primaryKey(),
  optedOutAt: timestamp('opted_out_at', { withTimezone: true }).notNull().defaultNow(),
});
