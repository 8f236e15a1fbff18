CREATE TYPE "public"."call_severity" AS ENUM('down', 'fault', 'cosmetic');--> statement-breakpoint
CREATE TYPE "public"."call_source" AS ENUM('game_tag', 'venue_view', 'staff');--> statement-breakpoint
CREATE TYPE "public"."call_state" AS ENUM('reported', 'assigned', 'on_the_way', 'on_site', 'waiting_parts', 'at_shop', 'fixed', 'closed', 'cancelled');--> statement-breakpoint
CREATE TYPE "public"."outbox_channel" AS ENUM('sms', 'email');--> statement-breakpoint
CREATE TYPE "public"."outbox_status" AS ENUM('pending', 'sending', 'sent', 'failed', 'blocked');--> statement-breakpoint
CREATE TYPE "public"."problem_kind" AS ENUM('dead', 'no_credit', 'ball_stuck', 'no_sound', 'display_out', 'other');--> statement-breakpoint
CREATE TABLE "sms_opt_outs" (
	"phone" text PRIMARY KEY NOT NULL,
	"opted_out_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "call_events" (
	"tenant_id" uuid NOT NULL,
	"id" uuid DEFAULT gen_random_uuid() NOT NULL,
	"call_id" uuid NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"actor_user_id" uuid,
	"actor_label" text DEFAULT '' NOT NULL,
	"kind" text NOT NULL,
	"from_state" "call_state",
	"to_state" "call_state",
	"detail" jsonb DEFAULT '{}'::jsonb NOT NULL,
	CONSTRAINT "call_events_tenant_id_id_pk" PRIMARY KEY("tenant_id","id")
);
--> statement-breakpoint
ALTER TABLE "call_events" ENABLE ROW LEVEL SECURITY;--> statement-breakpoint
CREATE TABLE "call_photos" (
	"tenant_id" uuid NOT NULL,
	"id" uuid DEFAULT gen_random_uuid() NOT NULL,
	"call_id" uuid NOT NULL,
	"storage_key" text NOT NULL,
	"thumb_key" text NOT NULL,
	"content_type" text NOT NULL,
	"bytes" integer NOT NULL,
	"width" integer NOT NULL,
	"height" integer NOT NULL,
	"uploaded_by" text DEFAULT 'reporter' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "call_photos_tenant_id_id_pk" PRIMARY KEY("tenant_id","id")
);
--> statement-breakpoint
ALTER TABLE "call_photos" ENABLE ROW LEVEL SECURITY;--> statement-breakpoint
CREATE TABLE "downtime_intervals" (
	"tenant_id" uuid NOT NULL,
	"id" uuid DEFAULT gen_random_uuid() NOT NULL,
	"game_id" uuid NOT NULL,
	"call_id" uuid,
	"started_at" timestamp with time zone NOT NULL,
	"ended_at" timestamp with time zone,
	CONSTRAINT "downtime_intervals_tenant_id_id_pk" PRIMARY KEY("tenant_id","id")
);
--> statement-breakpoint
ALTER TABLE "downtime_intervals" ENABLE ROW LEVEL SECURITY;--> statement-breakpoint
CREATE TABLE "outbox" (
	"tenant_id" uuid NOT NULL,
	"id" uuid DEFAULT gen_random_uuid() NOT NULL,
	"channel" "outbox_channel" NOT NULL,
	"to_address" text NOT NULL,
	"subject" text DEFAULT '' NOT NULL,
	"body" text NOT NULL,
	"call_id" uuid,
	"status" "outbox_status" DEFAULT 'pending' NOT NULL,
	"attempts" integer DEFAULT 0 NOT NULL,
	"next_attempt_at" timestamp with time zone DEFAULT now() NOT NULL,
	"claimed_at" timestamp with time zone,
	"last_error" text,
	"provider_id" text,
	"provider_status" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"sent_at" timestamp with time zone,
	CONSTRAINT "outbox_tenant_id_id_pk" PRIMARY KEY("tenant_id","id")
);
--> statement-breakpoint
ALTER TABLE "outbox" ENABLE ROW LEVEL SECURITY;--> statement-breakpoint
CREATE TABLE "service_calls" (
	"tenant_id" uuid NOT NULL,
	"id" uuid DEFAULT gen_random_uuid() NOT NULL,
	"game_id" uuid NOT NULL,
	"venue_id" uuid,
	"problem" "problem_kind" NOT NULL,
	"severity" "call_severity" NOT NULL,
	"state" "call_state" DEFAULT 'reported' NOT NULL,
	"source" "call_source" NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"reporter_phone" text,
	"reporter_sms_consent" boolean DEFAULT false NOT NULL,
	"technician_id" uuid,
	"accepted_at" timestamp with time zone,
	"created_by" uuid,
	"status_token" text NOT NULL,
	"opened_at" timestamp with time zone DEFAULT now() NOT NULL,
	"target_at" timestamp with time zone NOT NULL,
	"fixed_at" timestamp with time zone,
	"closed_at" timestamp with time zone,
	"warned_at" timestamp with time zone,
	"version" integer DEFAULT 1 NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "service_calls_tenant_id_id_pk" PRIMARY KEY("tenant_id","id")
);
--> statement-breakpoint
ALTER TABLE "service_calls" ENABLE ROW LEVEL SECURITY;--> statement-breakpoint
CREATE TABLE "technician_profiles" (
	"tenant_id" uuid NOT NULL,
	"user_id" uuid NOT NULL,
	"skills" text[] DEFAULT '{}'::text[] NOT NULL,
	"home_latitude" double precision,
	"home_longitude" double precision,
	"active" boolean DEFAULT true NOT NULL,
	CONSTRAINT "technician_profiles_tenant_id_user_id_pk" PRIMARY KEY("tenant_id","user_id")
);
--> statement-breakpoint
ALTER TABLE "technician_profiles" ENABLE ROW LEVEL SECURITY;--> statement-breakpoint
CREATE TABLE "tenant_settings" (
	"tenant_id" uuid PRIMARY KEY NOT NULL,
	"response_targets" jsonb DEFAULT '{"down":240,"fault":1440,"cosmetic":4320}'::jsonb NOT NULL,
	"warn_before_minutes" integer DEFAULT 30 NOT NULL,
	"map_tile_url" text DEFAULT '' NOT NULL,
	"dispatch_phone" text DEFAULT '' NOT NULL
);
--> statement-breakpoint
ALTER TABLE "tenant_settings" ENABLE ROW LEVEL SECURITY;--> statement-breakpoint
CREATE TABLE "venue_contacts" (
	"tenant_id" uuid NOT NULL,
	"venue_id" uuid NOT NULL,
	"user_id" uuid NOT NULL,
	CONSTRAINT "venue_contacts_tenant_id_venue_id_user_id_pk" PRIMARY KEY("tenant_id","venue_id","user_id")
);
--> statement-breakpoint
ALTER TABLE "venue_contacts" ENABLE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "users" ADD COLUMN "phone" text;--> statement-breakpoint
ALTER TABLE "call_events" ADD CONSTRAINT "call_events_tenant_id_tenants_id_fk" FOREIGN KEY ("tenant_id") REFERENCES "public"."tenants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "call_events" ADD CONSTRAINT "call_events_actor_user_id_users_id_fk" FOREIGN KEY ("actor_user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "call_events" ADD CONSTRAINT "call_events_tenant_id_call_id_service_calls_tenant_id_id_fk" FOREIGN KEY ("tenant_id","call_id") REFERENCES "public"."service_calls"("tenant_id","id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "call_photos" ADD CONSTRAINT "call_photos_tenant_id_tenants_id_fk" FOREIGN KEY ("tenant_id") REFERENCES "public"."tenants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "call_photos" ADD CONSTRAINT "call_photos_tenant_id_call_id_service_calls_tenant_id_id_fk" FOREIGN KEY ("tenant_id","call_id") REFERENCES "public"."service_calls"("tenant_id","id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "downtime_intervals" ADD CONSTRAINT "downtime_intervals_tenant_id_tenants_id_fk" FOREIGN KEY ("tenant_id") REFERENCES "public"."tenants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "downtime_intervals" ADD CONSTRAINT "downtime_intervals_tenant_id_game_id_games_tenant_id_id_fk" FOREIGN KEY ("tenant_id","game_id") REFERENCES "public"."games"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "outbox" ADD CONSTRAINT "outbox_tenant_id_tenants_id_fk" FOREIGN KEY ("tenant_id") REFERENCES "public"."tenants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "service_calls" ADD CONSTRAINT "service_calls_tenant_id_tenants_id_fk" FOREIGN KEY ("tenant_id") REFERENCES "public"."tenants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "service_calls" ADD CONSTRAINT "service_calls_technician_id_users_id_fk" FOREIGN KEY ("technician_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "service_calls" ADD CONSTRAINT "service_calls_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "service_calls" ADD CONSTRAINT "service_calls_tenant_id_game_id_games_tenant_id_id_fk" FOREIGN KEY ("tenant_id","game_id") REFERENCES "public"."games"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "service_calls" ADD CONSTRAINT "service_calls_tenant_id_venue_id_venues_tenant_id_id_fk" FOREIGN KEY ("tenant_id","venue_id") REFERENCES "public"."venues"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "technician_profiles" ADD CONSTRAINT "technician_profiles_tenant_id_tenants_id_fk" FOREIGN KEY ("tenant_id") REFERENCES "public"."tenants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "technician_profiles" ADD CONSTRAINT "technician_profiles_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tenant_settings" ADD CONSTRAINT "tenant_settings_tenant_id_tenants_id_fk" FOREIGN KEY ("tenant_id") REFERENCES "public"."tenants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "venue_contacts" ADD CONSTRAINT "venue_contacts_tenant_id_tenants_id_fk" FOREIGN KEY ("tenant_id") REFERENCES "public"."tenants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "venue_contacts" ADD CONSTRAINT "venue_contacts_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "venue_contacts" ADD CONSTRAINT "venue_contacts_tenant_id_venue_id_venues_tenant_id_id_fk" FOREIGN KEY ("tenant_id","venue_id") REFERENCES "public"."venues"("tenant_id","id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "call_events_tenant_call_idx" ON "call_events" USING btree ("tenant_id","call_id","at");--> statement-breakpoint
CREATE INDEX "call_photos_tenant_call_idx" ON "call_photos" USING btree ("tenant_id","call_id");--> statement-breakpoint
CREATE INDEX "downtime_tenant_game_idx" ON "downtime_intervals" USING btree ("tenant_id","game_id","started_at");--> statement-breakpoint
CREATE INDEX "outbox_tenant_due_idx" ON "outbox" USING btree ("tenant_id","status","next_attempt_at");--> statement-breakpoint
CREATE INDEX "outbox_tenant_call_idx" ON "outbox" USING btree ("tenant_id","call_id");--> statement-breakpoint
CREATE INDEX "outbox_provider_idx" ON "outbox" USING btree ("provider_id");--> statement-breakpoint
CREATE UNIQUE INDEX "service_calls_status_token_key" ON "service_calls" USING btree ("status_token");--> statement-breakpoint
CREATE INDEX "service_calls_tenant_state_idx" ON "service_calls" USING btree ("tenant_id","state","target_at");--> statement-breakpoint
CREATE INDEX "service_calls_tenant_game_idx" ON "service_calls" USING btree ("tenant_id","game_id","opened_at");--> statement-breakpoint
CREATE INDEX "service_calls_tenant_tech_idx" ON "service_calls" USING btree ("tenant_id","technician_id","state");--> statement-breakpoint
CREATE INDEX "venue_contacts_user_idx" ON "venue_contacts" USING btree ("tenant_id","user_id");--> statement-breakpoint
CREATE POLICY "tenant_isolation" ON "call_events" AS PERMISSIVE FOR ALL TO public USING ("call_events"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid) WITH CHECK ("call_events"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid);--> statement-breakpoint
CREATE POLICY "tenant_isolation" ON "call_photos" AS PERMISSIVE FOR ALL TO public USING ("call_photos"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid) WITH CHECK ("call_photos"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid);--> statement-breakpoint
CREATE POLICY "tenant_isolation" ON "downtime_intervals" AS PERMISSIVE FOR ALL TO public USING ("downtime_intervals"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid) WITH CHECK ("downtime_intervals"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid);--> statement-breakpoint
CREATE POLICY "tenant_isolation" ON "outbox" AS PERMISSIVE FOR ALL TO public USING ("outbox"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid) WITH CHECK ("outbox"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid);--> statement-breakpoint
CREATE POLICY "tenant_isolation" ON "service_calls" AS PERMISSIVE FOR ALL TO public USING ("service_calls"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid) WITH CHECK ("service_calls"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid);--> statement-breakpoint
CREATE POLICY "tenant_isolation" ON "technician_profiles" AS PERMISSIVE FOR ALL TO public USING ("technician_profiles"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid) WITH CHECK ("technician_profiles"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid);--> statement-breakpoint
CREATE POLICY "tenant_isolation" ON "tenant_settings" AS PERMISSIVE FOR ALL TO public USING ("tenant_settings"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid) WITH CHECK ("tenant_settings"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid);--> statement-breakpoint
CREATE POLICY "tenant_isolation" ON "venue_contacts" AS PERMISSIVE FOR ALL TO public USING ("venue_contacts"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid) WITH CHECK ("venue_contacts"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid);