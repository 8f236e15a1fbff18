-- Closed value sets become text with CHECK constraints (see packages/db/src/schema/enums.ts for why).
-- Two lookups return the old enum types: they are dropped here and made again at the end with text.
DROP FUNCTION invitation_by_token_hash(text);--> statement-breakpoint
DROP FUNCTION game_by_tag(text);--> statement-breakpoint
ALTER TABLE "games" ALTER COLUMN "status" DROP DEFAULT;--> statement-breakpoint
ALTER TABLE "outbox" ALTER COLUMN "status" DROP DEFAULT;--> statement-breakpoint
ALTER TABLE "service_calls" ALTER COLUMN "state" DROP DEFAULT;--> statement-breakpoint
DROP INDEX "service_calls_tenant_state_idx";--> statement-breakpoint
ALTER TABLE "invitations" ALTER COLUMN "role" SET DATA TYPE text USING "role"::text;--> statement-breakpoint
ALTER TABLE "memberships" ALTER COLUMN "role" SET DATA TYPE text USING "role"::text;--> statement-breakpoint
ALTER TABLE "game_models" ALTER COLUMN "kind" SET DATA TYPE text USING "kind"::text;--> statement-breakpoint
ALTER TABLE "games" ALTER COLUMN "status" SET DATA TYPE text USING "status"::text;--> statement-breakpoint
ALTER TABLE "games" ALTER COLUMN "status" SET DEFAULT 'running';--> statement-breakpoint
ALTER TABLE "call_events" ALTER COLUMN "from_state" SET DATA TYPE text USING "from_state"::text;--> statement-breakpoint
ALTER TABLE "call_events" ALTER COLUMN "to_state" SET DATA TYPE text USING "to_state"::text;--> statement-breakpoint
ALTER TABLE "outbox" ALTER COLUMN "channel" SET DATA TYPE text USING "channel"::text;--> statement-breakpoint
ALTER TABLE "outbox" ALTER COLUMN "status" SET DATA TYPE text USING "status"::text;--> statement-breakpoint
ALTER TABLE "outbox" ALTER COLUMN "status" SET DEFAULT 'pending';--> statement-breakpoint
ALTER TABLE "service_calls" ALTER COLUMN "problem" SET DATA TYPE text USING "problem"::text;--> statement-breakpoint
ALTER TABLE "service_calls" ALTER COLUMN "severity" SET DATA TYPE text USING "severity"::text;--> statement-breakpoint
ALTER TABLE "service_calls" ALTER COLUMN "state" SET DATA TYPE text USING "state"::text;--> statement-breakpoint
ALTER TABLE "service_calls" ALTER COLUMN "state" SET DEFAULT 'reported';--> statement-breakpoint
ALTER TABLE "service_calls" ALTER COLUMN "source" SET DATA TYPE text USING "source"::text;--> statement-breakpoint
CREATE INDEX "games_tenant_status_idx" ON "games" USING btree ("tenant_id","status");--> statement-breakpoint
CREATE INDEX "service_calls_tenant_open_target_idx" ON "service_calls" USING btree ("tenant_id","target_at","id") WHERE state in ('reported', 'assigned', 'on_the_way', 'on_site', 'waiting_parts', 'at_shop', 'fixed');--> statement-breakpoint
CREATE INDEX "service_calls_tenant_opened_idx" ON "service_calls" USING btree ("tenant_id","opened_at","id");--> statement-breakpoint
CREATE INDEX "service_calls_tenant_target_idx" ON "service_calls" USING btree ("tenant_id","target_at","id");--> statement-breakpoint
CREATE INDEX "service_calls_tenant_state_idx" ON "service_calls" USING btree ("tenant_id","state","target_at","id");--> statement-breakpoint
ALTER TABLE "invitations" ADD CONSTRAINT "invitations_role_check" CHECK ("role" in ('owner', 'dispatcher', 'technician', 'venue_contact'));--> statement-breakpoint
ALTER TABLE "memberships" ADD CONSTRAINT "memberships_role_check" CHECK ("role" in ('owner', 'dispatcher', 'technician', 'venue_contact'));--> statement-breakpoint
ALTER TABLE "game_models" ADD CONSTRAINT "game_models_kind_check" CHECK ("kind" in ('pinball', 'video', 'jukebox', 'darts', 'other'));--> statement-breakpoint
ALTER TABLE "games" ADD CONSTRAINT "games_status_check" CHECK ("status" in ('running', 'attention', 'down', 'in_shop'));--> statement-breakpoint
ALTER TABLE "call_events" ADD CONSTRAINT "call_events_from_state_check" CHECK ("from_state" in ('reported', 'assigned', 'on_the_way', 'on_site', 'waiting_parts', 'at_shop', 'fixed', 'closed', 'cancelled'));--> statement-breakpoint
ALTER TABLE "call_events" ADD CONSTRAINT "call_events_to_state_check" CHECK ("to_state" in ('reported', 'assigned', 'on_the_way', 'on_site', 'waiting_parts', 'at_shop', 'fixed', 'closed', 'cancelled'));--> statement-breakpoint
ALTER TABLE "outbox" ADD CONSTRAINT "outbox_channel_check" CHECK ("channel" in ('sms', 'email'));--> statement-breakpoint
ALTER TABLE "outbox" ADD CONSTRAINT "outbox_status_check" CHECK ("status" in ('pending', 'sending', 'sent', 'failed', 'blocked'));--> statement-breakpoint
ALTER TABLE "service_calls" ADD CONSTRAINT "service_calls_state_check" CHECK ("state" in ('reported', 'assigned', 'on_the_way', 'on_site', 'waiting_parts', 'at_shop', 'fixed', 'closed', 'cancelled'));--> statement-breakpoint
ALTER TABLE "service_calls" ADD CONSTRAINT "service_calls_problem_check" CHECK ("problem" in ('dead', 'no_credit', 'ball_stuck', 'no_sound', 'display_out', 'other'));--> statement-breakpoint
ALTER TABLE "service_calls" ADD CONSTRAINT "service_calls_severity_check" CHECK ("severity" in ('down', 'fault', 'cosmetic'));--> statement-breakpoint
ALTER TABLE "service_calls" ADD CONSTRAINT "service_calls_source_check" CHECK ("source" in ('game_tag', 'venue_view', 'staff'));--> statement-breakpoint
DROP TYPE "public"."call_severity";--> statement-breakpoint
DROP TYPE "public"."call_source";--> statement-breakpoint
DROP TYPE "public"."call_state";--> statement-breakpoint
DROP TYPE "public"."game_kind";--> statement-breakpoint
DROP TYPE "public"."game_status";--> statement-breakpoint
DROP TYPE "public"."member_role";--> statement-breakpoint
DROP TYPE "public"."outbox_channel";--> statement-breakpoint
DROP TYPE "public"."outbox_status";--> statement-breakpoint
DROP TYPE "public"."problem_kind";--> statement-breakpoint
CREATE FUNCTION invitation_by_token_hash(p_token_hash text)
RETURNS TABLE (tenant_id uuid, id uuid, email text, role text, expires_at timestamptz, accepted_at timestamptz, revoked_at timestamptz, tenant_name text)
LANGUAGE sql STABLE SECURITY DEFINER SET search_path = public, pg_temp AS $$
  SELECT i.tenant_id, i.id, i.email, i.role, i.expires_at, i.accepted_at, i.revoked_at, t.name
  FROM invitations i JOIN tenants t ON t.id = i.tenant_id
  WHERE i.token_hash = p_token_hash
$$;--> statement-breakpoint
CREATE FUNCTION game_by_tag(p_token text)
RETURNS TABLE (tenant_id uuid, game_id uuid, title text, kind text, venue_id uuid, venue_name text, retired boolean)
LANGUAGE sql STABLE SECURITY DEFINER SET search_path = public, pg_temp AS $$
  SELECT g.tenant_id, g.id, m.title, m.kind, g.venue_id, v.name, g.retired_at IS NOT NULL
  FROM games g
  JOIN game_models m ON m.tenant_id = g.tenant_id AND m.id = g.model_id
  LEFT JOIN venues v ON v.tenant_id = g.tenant_id AND v.id = g.venue_id
  WHERE g.tag_token = p_token
$$;--> statement-breakpoint
REVOKE ALL ON FUNCTION invitation_by_token_hash(text), game_by_tag(text) FROM public;--> statement-breakpoint
GRANT EXECUTE ON FUNCTION invitation_by_token_hash(text), game_by_tag(text) TO bumperline_app;
