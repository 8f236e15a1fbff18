CREATE TABLE "board_parts" (
	"tenant_id" uuid NOT NULL,
	"id" uuid DEFAULT gen_random_uuid() NOT NULL,
	"board_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"designator" text NOT NULL,
	"kind" text NOT NULL,
	"value" text NOT NULL,
	"tolerance" text DEFAULT '' NOT NULL,
	"rating" text DEFAULT '' NOT NULL,
	"rated_temperature_c" integer,
	"rated_life_hours" integer,
	"notes" text DEFAULT '' NOT NULL,
	"removed_at" timestamp with time zone,
	CONSTRAINT "board_parts_tenant_id_id_pk" PRIMARY KEY("tenant_id","id"),
	CONSTRAINT "board_parts_kind_check" CHECK ("kind" in ('resistor', 'capacitor', 'electrolytic', 'diode', 'bridge_rectifier', 'fuse', 'connector', 'transistor', 'regulator', 'other'))
);
--> statement-breakpoint
ALTER TABLE "board_parts" ENABLE ROW LEVEL SECURITY;--> statement-breakpoint
CREATE TABLE "model_boards" (
	"tenant_id" uuid NOT NULL,
	"id" uuid DEFAULT gen_random_uuid() NOT NULL,
	"model_id" uuid NOT NULL,
	"name" text NOT NULL,
	"part_number" text DEFAULT '' NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "model_boards_tenant_id_id_pk" PRIMARY KEY("tenant_id","id")
);
--> statement-breakpoint
ALTER TABLE "model_boards" ENABLE ROW LEVEL SECURITY;--> statement-breakpoint
CREATE TABLE "board_instances" (
	"tenant_id" uuid NOT NULL,
	"id" uuid DEFAULT gen_random_uuid() NOT NULL,
	"board_id" uuid NOT NULL,
	"game_id" uuid,
	"serial" text DEFAULT '' NOT NULL,
	"date_code" text DEFAULT '' NOT NULL,
	"made_on" date,
	"date_code_flag" text,
	"last_recap_on" date,
	"notes" text DEFAULT '' NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "board_instances_tenant_id_id_pk" PRIMARY KEY("tenant_id","id")
);
--> statement-breakpoint
ALTER TABLE "board_instances" ENABLE ROW LEVEL SECURITY;--> statement-breakpoint
CREATE TABLE "cabinet_profiles" (
	"tenant_id" uuid NOT NULL,
	"game_id" uuid NOT NULL,
	"slices" jsonb NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "cabinet_profiles_tenant_id_game_id_pk" PRIMARY KEY("tenant_id","game_id")
);
--> statement-breakpoint
ALTER TABLE "cabinet_profiles" ENABLE ROW LEVEL SECURITY;--> statement-breakpoint
CREATE TABLE "bench_job_parts_used" (
	"tenant_id" uuid NOT NULL,
	"id" uuid DEFAULT gen_random_uuid() NOT NULL,
	"job_id" uuid NOT NULL,
	"part_id" uuid,
	"description" text NOT NULL,
	"quantity" integer NOT NULL,
	CONSTRAINT "bench_job_parts_used_tenant_id_id_pk" PRIMARY KEY("tenant_id","id")
);
--> statement-breakpoint
ALTER TABLE "bench_job_parts_used" ENABLE ROW LEVEL SECURITY;--> statement-breakpoint
CREATE TABLE "bench_job_photos" (
	"tenant_id" uuid NOT NULL,
	"id" uuid DEFAULT gen_random_uuid() NOT NULL,
	"job_id" uuid NOT NULL,
	"step_key" text NOT NULL,
	"storage_key" text NOT NULL,
	"thumb_key" text NOT NULL,
	"content_type" text NOT NULL,
	"bytes" integer NOT NULL,
	"width" integer NOT NULL,
	"height" integer NOT NULL,
	"uploaded_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "bench_job_photos_tenant_id_id_pk" PRIMARY KEY("tenant_id","id")
);
--> statement-breakpoint
ALTER TABLE "bench_job_photos" ENABLE ROW LEVEL SECURITY;--> statement-breakpoint
CREATE TABLE "bench_jobs" (
	"tenant_id" uuid NOT NULL,
	"id" uuid DEFAULT gen_random_uuid() NOT NULL,
	"board_instance_id" uuid NOT NULL,
	"template_id" uuid,
	"template_name" text NOT NULL,
	"steps" jsonb NOT NULL,
	"origin" text NOT NULL,
	"service_call_id" uuid,
	"state" text DEFAULT 'in_progress' NOT NULL,
	"draft" jsonb NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"opened_by" uuid,
	"opened_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"finished_by" uuid,
	"finished_at" timestamp with time zone,
	CONSTRAINT "bench_jobs_tenant_id_id_pk" PRIMARY KEY("tenant_id","id"),
	CONSTRAINT "bench_jobs_state_check" CHECK ("state" in ('in_progress', 'finished')),
	CONSTRAINT "bench_jobs_origin_check" CHECK ("origin" in ('game', 'service_call', 'care_plan'))
);
--> statement-breakpoint
ALTER TABLE "bench_jobs" ENABLE ROW LEVEL SECURITY;--> statement-breakpoint
CREATE TABLE "bench_templates" (
	"tenant_id" uuid NOT NULL,
	"id" uuid DEFAULT gen_random_uuid() NOT NULL,
	"name" text NOT NULL,
	"description" text DEFAULT '' NOT NULL,
	"steps" jsonb NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "bench_templates_tenant_id_id_pk" PRIMARY KEY("tenant_id","id")
);
--> statement-breakpoint
ALTER TABLE "bench_templates" ENABLE ROW LEVEL SECURITY;--> statement-breakpoint
CREATE TABLE "part_readings" (
	"tenant_id" uuid NOT NULL,
	"id" uuid DEFAULT gen_random_uuid() NOT NULL,
	"board_instance_id" uuid NOT NULL,
	"part_id" uuid NOT NULL,
	"bench_job_id" uuid,
	"measured_text" text NOT NULL,
	"measured" double precision,
	"unit" text,
	"in_circuit" boolean DEFAULT false NOT NULL,
	"verdict" text NOT NULL,
	"indicative" boolean DEFAULT false NOT NULL,
	"min" double precision,
	"max" double precision,
	"deviation_percent" double precision,
	"note" text,
	"taken_at" timestamp with time zone DEFAULT now() NOT NULL,
	"taken_by" uuid,
	CONSTRAINT "part_readings_tenant_id_id_pk" PRIMARY KEY("tenant_id","id"),
	CONSTRAINT "part_readings_verdict_check" CHECK ("verdict" in ('pass', 'low', 'high', 'fail'))
);
--> statement-breakpoint
ALTER TABLE "part_readings" ENABLE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "board_parts" ADD CONSTRAINT "board_parts_tenant_id_tenants_id_fk" FOREIGN KEY ("tenant_id") REFERENCES "public"."tenants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "board_parts" ADD CONSTRAINT "board_parts_tenant_id_board_id_model_boards_tenant_id_id_fk" FOREIGN KEY ("tenant_id","board_id") REFERENCES "public"."model_boards"("tenant_id","id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "model_boards" ADD CONSTRAINT "model_boards_tenant_id_tenants_id_fk" FOREIGN KEY ("tenant_id") REFERENCES "public"."tenants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "model_boards" ADD CONSTRAINT "model_boards_tenant_id_model_id_game_models_tenant_id_id_fk" FOREIGN KEY ("tenant_id","model_id") REFERENCES "public"."game_models"("tenant_id","id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "board_instances" ADD CONSTRAINT "board_instances_tenant_id_tenants_id_fk" FOREIGN KEY ("tenant_id") REFERENCES "public"."tenants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "board_instances" ADD CONSTRAINT "board_instances_tenant_id_board_id_model_boards_tenant_id_id_fk" FOREIGN KEY ("tenant_id","board_id") REFERENCES "public"."model_boards"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "board_instances" ADD CONSTRAINT "board_instances_tenant_id_game_id_games_tenant_id_id_fk" FOREIGN KEY ("tenant_id","game_id") REFERENCES "public"."games"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cabinet_profiles" ADD CONSTRAINT "cabinet_profiles_tenant_id_tenants_id_fk" FOREIGN KEY ("tenant_id") REFERENCES "public"."tenants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cabinet_profiles" ADD CONSTRAINT "cabinet_profiles_tenant_id_game_id_games_tenant_id_id_fk" FOREIGN KEY ("tenant_id","game_id") REFERENCES "public"."games"("tenant_id","id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_job_parts_used" ADD CONSTRAINT "bench_job_parts_used_tenant_id_tenants_id_fk" FOREIGN KEY ("tenant_id") REFERENCES "public"."tenants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_job_parts_used" ADD CONSTRAINT "bench_job_parts_used_tenant_id_job_id_bench_jobs_tenant_id_id_fk" FOREIGN KEY ("tenant_id","job_id") REFERENCES "public"."bench_jobs"("tenant_id","id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_job_parts_used" ADD CONSTRAINT "bench_job_parts_used_tenant_id_part_id_board_parts_tenant_id_id_fk" FOREIGN KEY ("tenant_id","part_id") REFERENCES "public"."board_parts"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_job_photos" ADD CONSTRAINT "bench_job_photos_tenant_id_tenants_id_fk" FOREIGN KEY ("tenant_id") REFERENCES "public"."tenants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_job_photos" ADD CONSTRAINT "bench_job_photos_uploaded_by_users_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_job_photos" ADD CONSTRAINT "bench_job_photos_tenant_id_job_id_bench_jobs_tenant_id_id_fk" FOREIGN KEY ("tenant_id","job_id") REFERENCES "public"."bench_jobs"("tenant_id","id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_jobs" ADD CONSTRAINT "bench_jobs_tenant_id_tenants_id_fk" FOREIGN KEY ("tenant_id") REFERENCES "public"."tenants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_jobs" ADD CONSTRAINT "bench_jobs_opened_by_users_id_fk" FOREIGN KEY ("opened_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_jobs" ADD CONSTRAINT "bench_jobs_finished_by_users_id_fk" FOREIGN KEY ("finished_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_jobs" ADD CONSTRAINT "bench_jobs_tenant_id_board_instance_id_board_instances_tenant_id_id_fk" FOREIGN KEY ("tenant_id","board_instance_id") REFERENCES "public"."board_instances"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_jobs" ADD CONSTRAINT "bench_jobs_tenant_id_template_id_bench_templates_tenant_id_id_fk" FOREIGN KEY ("tenant_id","template_id") REFERENCES "public"."bench_templates"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_jobs" ADD CONSTRAINT "bench_jobs_tenant_id_service_call_id_service_calls_tenant_id_id_fk" FOREIGN KEY ("tenant_id","service_call_id") REFERENCES "public"."service_calls"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_templates" ADD CONSTRAINT "bench_templates_tenant_id_tenants_id_fk" FOREIGN KEY ("tenant_id") REFERENCES "public"."tenants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "part_readings" ADD CONSTRAINT "part_readings_tenant_id_tenants_id_fk" FOREIGN KEY ("tenant_id") REFERENCES "public"."tenants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "part_readings" ADD CONSTRAINT "part_readings_taken_by_users_id_fk" FOREIGN KEY ("taken_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "part_readings" ADD CONSTRAINT "part_readings_tenant_id_board_instance_id_board_instances_tenant_id_id_fk" FOREIGN KEY ("tenant_id","board_instance_id") REFERENCES "public"."board_instances"("tenant_id","id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "part_readings" ADD CONSTRAINT "part_readings_tenant_id_part_id_board_parts_tenant_id_id_fk" FOREIGN KEY ("tenant_id","part_id") REFERENCES "public"."board_parts"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "part_readings" ADD CONSTRAINT "part_readings_tenant_id_bench_job_id_bench_jobs_tenant_id_id_fk" FOREIGN KEY ("tenant_id","bench_job_id") REFERENCES "public"."bench_jobs"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "board_parts_tenant_board_designator_key" ON "board_parts" USING btree ("tenant_id","board_id","designator");--> statement-breakpoint
CREATE INDEX "board_parts_tenant_board_position_idx" ON "board_parts" USING btree ("tenant_id","board_id","position");--> statement-breakpoint
CREATE UNIQUE INDEX "model_boards_tenant_model_name_key" ON "model_boards" USING btree ("tenant_id","model_id","name");--> statement-breakpoint
CREATE INDEX "board_instances_tenant_game_idx" ON "board_instances" USING btree ("tenant_id","game_id");--> statement-breakpoint
CREATE INDEX "board_instances_tenant_board_idx" ON "board_instances" USING btree ("tenant_id","board_id");--> statement-breakpoint
CREATE INDEX "bench_job_parts_used_tenant_job_idx" ON "bench_job_parts_used" USING btree ("tenant_id","job_id");--> statement-breakpoint
CREATE INDEX "bench_job_photos_tenant_job_idx" ON "bench_job_photos" USING btree ("tenant_id","job_id","created_at");--> statement-breakpoint
CREATE INDEX "bench_jobs_tenant_instance_idx" ON "bench_jobs" USING btree ("tenant_id","board_instance_id","opened_at");--> statement-breakpoint
CREATE INDEX "bench_jobs_tenant_state_idx" ON "bench_jobs" USING btree ("tenant_id","state","opened_at","id");--> statement-breakpoint
CREATE INDEX "bench_jobs_tenant_call_idx" ON "bench_jobs" USING btree ("tenant_id","service_call_id") WHERE service_call_id is not null;--> statement-breakpoint
CREATE INDEX "bench_templates_tenant_name_idx" ON "bench_templates" USING btree ("tenant_id","name","id");--> statement-breakpoint
CREATE INDEX "part_readings_tenant_instance_part_idx" ON "part_readings" USING btree ("tenant_id","board_instance_id","part_id","taken_at");--> statement-breakpoint
CREATE INDEX "part_readings_tenant_job_idx" ON "part_readings" USING btree ("tenant_id","bench_job_id") WHERE bench_job_id is not null;--> statement-breakpoint
CREATE POLICY "tenant_isolation" ON "board_parts" AS PERMISSIVE FOR ALL TO public USING ("board_parts"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid) WITH CHECK ("board_parts"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid);--> statement-breakpoint
CREATE POLICY "tenant_isolation" ON "model_boards" AS PERMISSIVE FOR ALL TO public USING ("model_boards"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid) WITH CHECK ("model_boards"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid);--> statement-breakpoint
CREATE POLICY "tenant_isolation" ON "board_instances" AS PERMISSIVE FOR ALL TO public USING ("board_instances"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid) WITH CHECK ("board_instances"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid);--> statement-breakpoint
CREATE POLICY "tenant_isolation" ON "cabinet_profiles" AS PERMISSIVE FOR ALL TO public USING ("cabinet_profiles"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid) WITH CHECK ("cabinet_profiles"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid);--> statement-breakpoint
CREATE POLICY "tenant_isolation" ON "bench_job_parts_used" AS PERMISSIVE FOR ALL TO public USING ("bench_job_parts_used"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid) WITH CHECK ("bench_job_parts_used"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid);--> statement-breakpoint
CREATE POLICY "tenant_isolation" ON "bench_job_photos" AS PERMISSIVE FOR ALL TO public USING ("bench_job_photos"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid) WITH CHECK ("bench_job_photos"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid);--> statement-breakpoint
CREATE POLICY "tenant_isolation" ON "bench_jobs" AS PERMISSIVE FOR ALL TO public USING ("bench_jobs"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid) WITH CHECK ("bench_jobs"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid);--> statement-breakpoint
CREATE POLICY "tenant_isolation" ON "bench_templates" AS PERMISSIVE FOR ALL TO public USING ("bench_templates"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid) WITH CHECK ("bench_templates"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid);--> statement-breakpoint
CREATE POLICY "tenant_isolation" ON "part_readings" AS PERMISSIVE FOR ALL TO public USING ("part_readings"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid) WITH CHECK ("part_readings"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid);