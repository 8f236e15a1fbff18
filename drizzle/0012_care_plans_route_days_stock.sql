CREATE TABLE "game_meters" (
	"tenant_id" uuid NOT NULL,
	"game_id" uuid NOT NULL,
	"meter" text NOT NULL,
	"rolls_over_at" bigint,
	CONSTRAINT "game_meters_tenant_id_game_id_meter_pk" PRIMARY KEY("tenant_id","game_id","meter"),
	CONSTRAINT "game_meters_meter_check" CHECK ("meter" in ('plays', 'hours', 'coins_in', 'bills_in', 'credits')),
	CONSTRAINT "game_meters_rolls_over_at_check" CHECK (rolls_over_at is null or rolls_over_at > 0)
);
--> statement-breakpoint
ALTER TABLE "game_meters" ENABLE ROW LEVEL SECURITY;--> statement-breakpoint
CREATE TABLE "meter_readings" (
	"tenant_id" uuid NOT NULL,
	"id" uuid DEFAULT gen_random_uuid() NOT NULL,
	"game_id" uuid NOT NULL,
	"meter" text NOT NULL,
	"reading" bigint NOT NULL,
	"rolled_over" boolean DEFAULT false NOT NULL,
	"source" text NOT NULL,
	"work_order_id" uuid,
	"read_at" timestamp with time zone DEFAULT now() NOT NULL,
	"read_by" uuid,
	CONSTRAINT "meter_readings_tenant_id_id_pk" PRIMARY KEY("tenant_id","id"),
	CONSTRAINT "meter_readings_meter_check" CHECK ("meter" in ('plays', 'hours', 'coins_in', 'bills_in', 'credits')),
	CONSTRAINT "meter_readings_source_check" CHECK ("source" in ('visit', 'work_order', 'collection')),
	CONSTRAINT "meter_readings_reading_check" CHECK (reading >= 0)
);
--> statement-breakpoint
ALTER TABLE "meter_readings" ENABLE ROW LEVEL SECURITY;--> statement-breakpoint
CREATE TABLE "care_plans" (
	"tenant_id" uuid NOT NULL,
	"id" uuid DEFAULT gen_random_uuid() NOT NULL,
	"name" text NOT NULL,
	"scope" text NOT NULL,
	"model_id" uuid,
	"game_id" uuid,
	"tasks" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"bench_template_id" uuid,
	"skills" text[] DEFAULT '{}'::text[] NOT NULL,
	"on_site_minutes" integer NOT NULL,
	"rule" text,
	"rule_start" text,
	"plays_every" integer,
	"hours_every" integer,
	"by_capacitor_life" boolean DEFAULT false NOT NULL,
	"lead_days" integer DEFAULT 7 NOT NULL,
	"technician_id" uuid,
	"next_check_at" timestamp with time zone DEFAULT now() NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"retired_at" timestamp with time zone,
	CONSTRAINT "care_plans_tenant_id_id_pk" PRIMARY KEY("tenant_id","id"),
	CONSTRAINT "care_plans_scope_check" CHECK ("scope" in ('model', 'game')),
	CONSTRAINT "care_plans_target_check" CHECK ((scope = 'model' and model_id is not null and game_id is null) or (scope = 'game' and game_id is not null and model_id is null)),
	CONSTRAINT "care_plans_trigger_check" CHECK (rule is not null or plays_every is not null or hours_every is not null or by_capacitor_life),
	CONSTRAINT "care_plans_rule_start_check" CHECK ((rule is null) = (rule_start is null)),
	CONSTRAINT "care_plans_positive_check" CHECK (on_site_minutes > 0 and coalesce(plays_every, 1) > 0 and coalesce(hours_every, 1) > 0 and lead_days >= 0)
);
--> statement-breakpoint
ALTER TABLE "care_plans" ENABLE ROW LEVEL SECURITY;--> statement-breakpoint
CREATE TABLE "work_orders" (
	"tenant_id" uuid NOT NULL,
	"id" uuid DEFAULT gen_random_uuid() NOT NULL,
	"care_plan_id" uuid NOT NULL,
	"game_id" uuid NOT NULL,
	"due_at" timestamp with time zone NOT NULL,
	"due_reason" text NOT NULL,
	"title" text NOT NULL,
	"tasks" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"bench_template_id" uuid,
	"bench_job_id" uuid,
	"skills" text[] DEFAULT '{}'::text[] NOT NULL,
	"on_site_minutes" integer NOT NULL,
	"state" text DEFAULT 'open' NOT NULL,
	"technician_id" uuid,
	"planned_on" date,
	"note" text DEFAULT '' NOT NULL,
	"skip_reason" text,
	"labour_minutes" integer,
	"plays_at_done" bigint,
	"hours_at_done" bigint,
	"closed_at" timestamp with time zone,
	"closed_by" uuid,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "work_orders_tenant_id_id_pk" PRIMARY KEY("tenant_id","id"),
	CONSTRAINT "work_orders_due_reason_check" CHECK ("due_reason" in ('calendar', 'plays', 'hours', 'capacitor_life')),
	CONSTRAINT "work_orders_state_check" CHECK ("state" in ('open', 'done', 'skipped')),
	CONSTRAINT "work_orders_skip_reason_check" CHECK (state <> 'skipped' or length(trim(skip_reason)) > 0),
	CONSTRAINT "work_orders_labour_check" CHECK (labour_minutes is null or labour_minutes >= 0)
);
--> statement-breakpoint
ALTER TABLE "work_orders" ENABLE ROW LEVEL SECURITY;--> statement-breakpoint
CREATE TABLE "catalogue_parts" (
	"tenant_id" uuid NOT NULL,
	"id" uuid DEFAULT gen_random_uuid() NOT NULL,
	"part_number" text NOT NULL,
	"description" text NOT NULL,
	"kind" text NOT NULL,
	"unit" text DEFAULT 'each' NOT NULL,
	"unit_cost_cents" integer NOT NULL,
	"supplier" text DEFAULT '' NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"retired_at" timestamp with time zone,
	CONSTRAINT "catalogue_parts_tenant_id_id_pk" PRIMARY KEY("tenant_id","id"),
	CONSTRAINT "catalogue_parts_kind_check" CHECK ("kind" in ('resistor', 'capacitor', 'electrolytic', 'diode', 'bridge_rectifier', 'fuse', 'connector', 'transistor', 'regulator', 'other')),
	CONSTRAINT "catalogue_parts_unit_check" CHECK ("unit" in ('each', 'm', 'g', 'ml')),
	CONSTRAINT "catalogue_parts_cost_check" CHECK (unit_cost_cents >= 0)
);
--> statement-breakpoint
ALTER TABLE "catalogue_parts" ENABLE ROW LEVEL SECURITY;--> statement-breakpoint
CREATE TABLE "part_fits" (
	"tenant_id" uuid NOT NULL,
	"catalogue_part_id" uuid NOT NULL,
	"board_part_id" uuid NOT NULL,
	CONSTRAINT "part_fits_tenant_id_catalogue_part_id_board_part_id_pk" PRIMARY KEY("tenant_id","catalogue_part_id","board_part_id")
);
--> statement-breakpoint
ALTER TABLE "part_fits" ENABLE ROW LEVEL SECURITY;--> statement-breakpoint
CREATE TABLE "parts_used" (
	"tenant_id" uuid NOT NULL,
	"id" uuid DEFAULT gen_random_uuid() NOT NULL,
	"game_id" uuid NOT NULL,
	"service_call_id" uuid,
	"work_order_id" uuid,
	"catalogue_part_id" uuid NOT NULL,
	"location_id" uuid NOT NULL,
	"quantity" numeric(14, 3) NOT NULL,
	"unit_cost_cents" integer NOT NULL,
	"movement_id" uuid NOT NULL,
	"used_at" timestamp with time zone DEFAULT now() NOT NULL,
	"used_by" uuid,
	CONSTRAINT "parts_used_tenant_id_id_pk" PRIMARY KEY("tenant_id","id"),
	CONSTRAINT "parts_used_one_job_check" CHECK ((service_call_id is null) <> (work_order_id is null)),
	CONSTRAINT "parts_used_quantity_check" CHECK (quantity > 0)
);
--> statement-breakpoint
ALTER TABLE "parts_used" ENABLE ROW LEVEL SECURITY;--> statement-breakpoint
CREATE TABLE "stock_levels" (
	"tenant_id" uuid NOT NULL,
	"location_id" uuid NOT NULL,
	"catalogue_part_id" uuid NOT NULL,
	"quantity" numeric(14, 3) DEFAULT 0 NOT NULL,
	"reorder_point" numeric(14, 3),
	"reorder_quantity" numeric(14, 3),
	"counted_at" timestamp with time zone,
	"version" integer DEFAULT 1 NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "stock_levels_tenant_id_location_id_catalogue_part_id_pk" PRIMARY KEY("tenant_id","location_id","catalogue_part_id"),
	CONSTRAINT "stock_levels_quantity_check" CHECK (quantity >= 0),
	CONSTRAINT "stock_levels_reorder_check" CHECK (coalesce(reorder_point, 0) >= 0 and coalesce(reorder_quantity, 1) > 0)
);
--> statement-breakpoint
ALTER TABLE "stock_levels" ENABLE ROW LEVEL SECURITY;--> statement-breakpoint
CREATE TABLE "stock_locations" (
	"tenant_id" uuid NOT NULL,
	"id" uuid DEFAULT gen_random_uuid() NOT NULL,
	"kind" text NOT NULL,
	"name" text NOT NULL,
	"technician_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"retired_at" timestamp with time zone,
	CONSTRAINT "stock_locations_tenant_id_id_pk" PRIMARY KEY("tenant_id","id"),
	CONSTRAINT "stock_locations_kind_check" CHECK ("kind" in ('warehouse', 'van')),
	CONSTRAINT "stock_locations_van_check" CHECK (kind = 'van' or technician_id is null)
);
--> statement-breakpoint
ALTER TABLE "stock_locations" ENABLE ROW LEVEL SECURITY;--> statement-breakpoint
CREATE TABLE "stock_movements" (
	"tenant_id" uuid NOT NULL,
	"id" uuid DEFAULT gen_random_uuid() NOT NULL,
	"catalogue_part_id" uuid NOT NULL,
	"reason" text NOT NULL,
	"from_location_id" uuid,
	"to_location_id" uuid,
	"quantity" numeric(14, 3) NOT NULL,
	"expected_quantity" numeric(14, 3),
	"counted_quantity" numeric(14, 3),
	"unit_cost_cents" integer NOT NULL,
	"service_call_id" uuid,
	"work_order_id" uuid,
	"bench_job_id" uuid,
	"note" text DEFAULT '' NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"by" uuid,
	CONSTRAINT "stock_movements_tenant_id_id_pk" PRIMARY KEY("tenant_id","id"),
	CONSTRAINT "stock_movements_reason_check" CHECK ("reason" in ('received', 'transfer', 'used', 'counted')),
	CONSTRAINT "stock_movements_quantity_check" CHECK (quantity >= 0),
	CONSTRAINT "stock_movements_shape_check" CHECK ((reason = 'received' and from_location_id is null and to_location_id is not null)
        or (reason = 'transfer' and from_location_id is not null and to_location_id is not null and from_location_id <> to_location_id)
        or (reason = 'used' and from_location_id is not null and to_location_id is null)
        or (reason = 'counted' and to_location_id is not null and expected_quantity is not null and counted_quantity is not null))
);
--> statement-breakpoint
ALTER TABLE "stock_movements" ENABLE ROW LEVEL SECURITY;--> statement-breakpoint
CREATE TABLE "keep_cost_entries" (
	"tenant_id" uuid NOT NULL,
	"id" uuid DEFAULT gen_random_uuid() NOT NULL,
	"game_id" uuid NOT NULL,
	"source" text NOT NULL,
	"source_id" uuid NOT NULL,
	"parts_cents" bigint NOT NULL,
	"labour_minutes" integer NOT NULL,
	"labour_rate_cents" integer NOT NULL,
	"labour_cents" bigint NOT NULL,
	"technician_id" uuid,
	"recorded_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "keep_cost_entries_tenant_id_id_pk" PRIMARY KEY("tenant_id","id"),
	CONSTRAINT "keep_cost_entries_source_check" CHECK ("source" in ('service_call', 'work_order', 'bench_job')),
	CONSTRAINT "keep_cost_entries_amounts_check" CHECK (parts_cents >= 0 and labour_minutes >= 0 and labour_cents >= 0)
);
--> statement-breakpoint
ALTER TABLE "keep_cost_entries" ENABLE ROW LEVEL SECURITY;--> statement-breakpoint
CREATE TABLE "applied_changes" (
	"tenant_id" uuid NOT NULL,
	"key" text NOT NULL,
	"user_id" uuid,
	"method" text NOT NULL,
	"path" text NOT NULL,
	"status" integer NOT NULL,
	"body" jsonb,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "applied_changes_tenant_id_key_pk" PRIMARY KEY("tenant_id","key")
);
--> statement-breakpoint
ALTER TABLE "applied_changes" ENABLE ROW LEVEL SECURITY;--> statement-breakpoint
CREATE TABLE "route_days" (
	"tenant_id" uuid NOT NULL,
	"technician_id" uuid NOT NULL,
	"day" date NOT NULL,
	"stop_order" uuid[] DEFAULT '{}'::uuid[] NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_by" uuid,
	CONSTRAINT "route_days_tenant_id_technician_id_day_pk" PRIMARY KEY("tenant_id","technician_id","day")
);
--> statement-breakpoint
ALTER TABLE "route_days" ENABLE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "service_calls" ADD COLUMN "planned_on" date;--> statement-breakpoint
ALTER TABLE "tenant_settings" ADD COLUMN "labour_rate_cents" integer DEFAULT 4500 NOT NULL;--> statement-breakpoint
ALTER TABLE "tenant_settings" ADD COLUMN "average_speed_kmh" integer DEFAULT 35 NOT NULL;--> statement-breakpoint
ALTER TABLE "technician_profiles" ADD COLUMN "day_start" text DEFAULT '08:00' NOT NULL;--> statement-breakpoint
ALTER TABLE "technician_profiles" ADD COLUMN "day_end" text DEFAULT '17:00' NOT NULL;--> statement-breakpoint
ALTER TABLE "bench_job_parts_used" ADD COLUMN "catalogue_part_id" uuid;--> statement-breakpoint
ALTER TABLE "bench_jobs" ADD COLUMN "technician_id" uuid;--> statement-breakpoint
ALTER TABLE "bench_jobs" ADD COLUMN "planned_on" date;--> statement-breakpoint
ALTER TABLE "game_meters" ADD CONSTRAINT "game_meters_tenant_id_tenants_id_fk" FOREIGN KEY ("tenant_id") REFERENCES "public"."tenants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "game_meters" ADD CONSTRAINT "game_meters_tenant_id_game_id_games_tenant_id_id_fk" FOREIGN KEY ("tenant_id","game_id") REFERENCES "public"."games"("tenant_id","id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "meter_readings" ADD CONSTRAINT "meter_readings_tenant_id_tenants_id_fk" FOREIGN KEY ("tenant_id") REFERENCES "public"."tenants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "meter_readings" ADD CONSTRAINT "meter_readings_read_by_users_id_fk" FOREIGN KEY ("read_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "meter_readings" ADD CONSTRAINT "meter_readings_tenant_id_game_id_games_tenant_id_id_fk" FOREIGN KEY ("tenant_id","game_id") REFERENCES "public"."games"("tenant_id","id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "meter_readings" ADD CONSTRAINT "meter_readings_tenant_id_work_order_id_work_orders_tenant_id_id_fk" FOREIGN KEY ("tenant_id","work_order_id") REFERENCES "public"."work_orders"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "care_plans" ADD CONSTRAINT "care_plans_tenant_id_tenants_id_fk" FOREIGN KEY ("tenant_id") REFERENCES "public"."tenants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "care_plans" ADD CONSTRAINT "care_plans_technician_id_users_id_fk" FOREIGN KEY ("technician_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "care_plans" ADD CONSTRAINT "care_plans_tenant_id_model_id_game_models_tenant_id_id_fk" FOREIGN KEY ("tenant_id","model_id") REFERENCES "public"."game_models"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "care_plans" ADD CONSTRAINT "care_plans_tenant_id_game_id_games_tenant_id_id_fk" FOREIGN KEY ("tenant_id","game_id") REFERENCES "public"."games"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "care_plans" ADD CONSTRAINT "care_plans_tenant_id_bench_template_id_bench_templates_tenant_id_id_fk" FOREIGN KEY ("tenant_id","bench_template_id") REFERENCES "public"."bench_templates"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "work_orders" ADD CONSTRAINT "work_orders_tenant_id_tenants_id_fk" FOREIGN KEY ("tenant_id") REFERENCES "public"."tenants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "work_orders" ADD CONSTRAINT "work_orders_technician_id_users_id_fk" FOREIGN KEY ("technician_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "work_orders" ADD CONSTRAINT "work_orders_closed_by_users_id_fk" FOREIGN KEY ("closed_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "work_orders" ADD CONSTRAINT "work_orders_tenant_id_care_plan_id_care_plans_tenant_id_id_fk" FOREIGN KEY ("tenant_id","care_plan_id") REFERENCES "public"."care_plans"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "work_orders" ADD CONSTRAINT "work_orders_tenant_id_game_id_games_tenant_id_id_fk" FOREIGN KEY ("tenant_id","game_id") REFERENCES "public"."games"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "work_orders" ADD CONSTRAINT "work_orders_tenant_id_bench_template_id_bench_templates_tenant_id_id_fk" FOREIGN KEY ("tenant_id","bench_template_id") REFERENCES "public"."bench_templates"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "work_orders" ADD CONSTRAINT "work_orders_tenant_id_bench_job_id_bench_jobs_tenant_id_id_fk" FOREIGN KEY ("tenant_id","bench_job_id") REFERENCES "public"."bench_jobs"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "catalogue_parts" ADD CONSTRAINT "catalogue_parts_tenant_id_tenants_id_fk" FOREIGN KEY ("tenant_id") REFERENCES "public"."tenants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "part_fits" ADD CONSTRAINT "part_fits_tenant_id_tenants_id_fk" FOREIGN KEY ("tenant_id") REFERENCES "public"."tenants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "part_fits" ADD CONSTRAINT "part_fits_tenant_id_catalogue_part_id_catalogue_parts_tenant_id_id_fk" FOREIGN KEY ("tenant_id","catalogue_part_id") REFERENCES "public"."catalogue_parts"("tenant_id","id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "part_fits" ADD CONSTRAINT "part_fits_tenant_id_board_part_id_board_parts_tenant_id_id_fk" FOREIGN KEY ("tenant_id","board_part_id") REFERENCES "public"."board_parts"("tenant_id","id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "parts_used" ADD CONSTRAINT "parts_used_tenant_id_tenants_id_fk" FOREIGN KEY ("tenant_id") REFERENCES "public"."tenants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "parts_used" ADD CONSTRAINT "parts_used_used_by_users_id_fk" FOREIGN KEY ("used_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "parts_used" ADD CONSTRAINT "parts_used_tenant_id_game_id_games_tenant_id_id_fk" FOREIGN KEY ("tenant_id","game_id") REFERENCES "public"."games"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "parts_used" ADD CONSTRAINT "parts_used_tenant_id_service_call_id_service_calls_tenant_id_id_fk" FOREIGN KEY ("tenant_id","service_call_id") REFERENCES "public"."service_calls"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "parts_used" ADD CONSTRAINT "parts_used_tenant_id_work_order_id_work_orders_tenant_id_id_fk" FOREIGN KEY ("tenant_id","work_order_id") REFERENCES "public"."work_orders"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "parts_used" ADD CONSTRAINT "parts_used_tenant_id_catalogue_part_id_catalogue_parts_tenant_id_id_fk" FOREIGN KEY ("tenant_id","catalogue_part_id") REFERENCES "public"."catalogue_parts"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "parts_used" ADD CONSTRAINT "parts_used_tenant_id_location_id_stock_locations_tenant_id_id_fk" FOREIGN KEY ("tenant_id","location_id") REFERENCES "public"."stock_locations"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "parts_used" ADD CONSTRAINT "parts_used_tenant_id_movement_id_stock_movements_tenant_id_id_fk" FOREIGN KEY ("tenant_id","movement_id") REFERENCES "public"."stock_movements"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_levels" ADD CONSTRAINT "stock_levels_tenant_id_tenants_id_fk" FOREIGN KEY ("tenant_id") REFERENCES "public"."tenants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_levels" ADD CONSTRAINT "stock_levels_tenant_id_location_id_stock_locations_tenant_id_id_fk" FOREIGN KEY ("tenant_id","location_id") REFERENCES "public"."stock_locations"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_levels" ADD CONSTRAINT "stock_levels_tenant_id_catalogue_part_id_catalogue_parts_tenant_id_id_fk" FOREIGN KEY ("tenant_id","catalogue_part_id") REFERENCES "public"."catalogue_parts"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_locations" ADD CONSTRAINT "stock_locations_tenant_id_tenants_id_fk" FOREIGN KEY ("tenant_id") REFERENCES "public"."tenants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_locations" ADD CONSTRAINT "stock_locations_technician_id_users_id_fk" FOREIGN KEY ("technician_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_movements" ADD CONSTRAINT "stock_movements_tenant_id_tenants_id_fk" FOREIGN KEY ("tenant_id") REFERENCES "public"."tenants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_movements" ADD CONSTRAINT "stock_movements_by_users_id_fk" FOREIGN KEY ("by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_movements" ADD CONSTRAINT "stock_movements_tenant_id_catalogue_part_id_catalogue_parts_tenant_id_id_fk" FOREIGN KEY ("tenant_id","catalogue_part_id") REFERENCES "public"."catalogue_parts"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_movements" ADD CONSTRAINT "stock_movements_tenant_id_from_location_id_stock_locations_tenant_id_id_fk" FOREIGN KEY ("tenant_id","from_location_id") REFERENCES "public"."stock_locations"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_movements" ADD CONSTRAINT "stock_movements_tenant_id_to_location_id_stock_locations_tenant_id_id_fk" FOREIGN KEY ("tenant_id","to_location_id") REFERENCES "public"."stock_locations"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_movements" ADD CONSTRAINT "stock_movements_tenant_id_service_call_id_service_calls_tenant_id_id_fk" FOREIGN KEY ("tenant_id","service_call_id") REFERENCES "public"."service_calls"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_movements" ADD CONSTRAINT "stock_movements_tenant_id_work_order_id_work_orders_tenant_id_id_fk" FOREIGN KEY ("tenant_id","work_order_id") REFERENCES "public"."work_orders"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_movements" ADD CONSTRAINT "stock_movements_tenant_id_bench_job_id_bench_jobs_tenant_id_id_fk" FOREIGN KEY ("tenant_id","bench_job_id") REFERENCES "public"."bench_jobs"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "keep_cost_entries" ADD CONSTRAINT "keep_cost_entries_tenant_id_tenants_id_fk" FOREIGN KEY ("tenant_id") REFERENCES "public"."tenants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "keep_cost_entries" ADD CONSTRAINT "keep_cost_entries_technician_id_users_id_fk" FOREIGN KEY ("technician_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "keep_cost_entries" ADD CONSTRAINT "keep_cost_entries_tenant_id_game_id_games_tenant_id_id_fk" FOREIGN KEY ("tenant_id","game_id") REFERENCES "public"."games"("tenant_id","id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "applied_changes" ADD CONSTRAINT "applied_changes_tenant_id_tenants_id_fk" FOREIGN KEY ("tenant_id") REFERENCES "public"."tenants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "applied_changes" ADD CONSTRAINT "applied_changes_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "route_days" ADD CONSTRAINT "route_days_tenant_id_tenants_id_fk" FOREIGN KEY ("tenant_id") REFERENCES "public"."tenants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "route_days" ADD CONSTRAINT "route_days_technician_id_users_id_fk" FOREIGN KEY ("technician_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "route_days" ADD CONSTRAINT "route_days_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "meter_readings_tenant_game_meter_idx" ON "meter_readings" USING btree ("tenant_id","game_id","meter","read_at","id");--> statement-breakpoint
CREATE INDEX "care_plans_tenant_name_idx" ON "care_plans" USING btree ("tenant_id",lower("name"),"id");--> statement-breakpoint
CREATE INDEX "care_plans_tenant_model_idx" ON "care_plans" USING btree ("tenant_id","model_id") WHERE model_id is not null;--> statement-breakpoint
CREATE INDEX "care_plans_tenant_game_idx" ON "care_plans" USING btree ("tenant_id","game_id") WHERE game_id is not null;--> statement-breakpoint
CREATE UNIQUE INDEX "work_orders_one_open_key" ON "work_orders" USING btree ("tenant_id","care_plan_id","game_id") WHERE state = 'open';--> statement-breakpoint
CREATE INDEX "work_orders_tenant_plan_game_idx" ON "work_orders" USING btree ("tenant_id","care_plan_id","game_id","closed_at");--> statement-breakpoint
CREATE INDEX "work_orders_tenant_open_due_idx" ON "work_orders" USING btree ("tenant_id","due_at","id") WHERE state = 'open';--> statement-breakpoint
CREATE INDEX "work_orders_tenant_tech_day_idx" ON "work_orders" USING btree ("tenant_id","technician_id","planned_on","id") WHERE state = 'open';--> statement-breakpoint
CREATE INDEX "work_orders_tenant_game_idx" ON "work_orders" USING btree ("tenant_id","game_id","created_at","id");--> statement-breakpoint
CREATE INDEX "work_orders_tenant_state_idx" ON "work_orders" USING btree ("tenant_id","state","due_at","id");--> statement-breakpoint
CREATE UNIQUE INDEX "catalogue_parts_tenant_number_key" ON "catalogue_parts" USING btree ("tenant_id",lower("part_number"));--> statement-breakpoint
CREATE INDEX "catalogue_parts_tenant_number_idx" ON "catalogue_parts" USING btree ("tenant_id","part_number","id");--> statement-breakpoint
CREATE INDEX "part_fits_tenant_board_part_idx" ON "part_fits" USING btree ("tenant_id","board_part_id");--> statement-breakpoint
CREATE INDEX "parts_used_tenant_call_idx" ON "parts_used" USING btree ("tenant_id","service_call_id") WHERE service_call_id is not null;--> statement-breakpoint
CREATE INDEX "parts_used_tenant_work_order_idx" ON "parts_used" USING btree ("tenant_id","work_order_id") WHERE work_order_id is not null;--> statement-breakpoint
CREATE INDEX "parts_used_tenant_game_idx" ON "parts_used" USING btree ("tenant_id","game_id","used_at","id");--> statement-breakpoint
CREATE INDEX "stock_levels_tenant_part_idx" ON "stock_levels" USING btree ("tenant_id","catalogue_part_id");--> statement-breakpoint
CREATE INDEX "stock_levels_tenant_reorder_idx" ON "stock_levels" USING btree ("tenant_id","location_id","catalogue_part_id") WHERE quantity <= reorder_point;--> statement-breakpoint
CREATE UNIQUE INDEX "stock_locations_tenant_van_key" ON "stock_locations" USING btree ("tenant_id","technician_id") WHERE technician_id is not null;--> statement-breakpoint
CREATE INDEX "stock_locations_tenant_kind_idx" ON "stock_locations" USING btree ("tenant_id","kind","name","id");--> statement-breakpoint
CREATE INDEX "stock_movements_tenant_part_idx" ON "stock_movements" USING btree ("tenant_id","catalogue_part_id","at","id");--> statement-breakpoint
CREATE INDEX "stock_movements_tenant_from_idx" ON "stock_movements" USING btree ("tenant_id","from_location_id","at","id") WHERE from_location_id is not null;--> statement-breakpoint
CREATE INDEX "stock_movements_tenant_to_idx" ON "stock_movements" USING btree ("tenant_id","to_location_id","at","id") WHERE to_location_id is not null;--> statement-breakpoint
CREATE UNIQUE INDEX "keep_cost_entries_source_key" ON "keep_cost_entries" USING btree ("tenant_id","source","source_id");--> statement-breakpoint
CREATE INDEX "keep_cost_entries_tenant_game_idx" ON "keep_cost_entries" USING btree ("tenant_id","game_id","recorded_at","id");--> statement-breakpoint
CREATE INDEX "applied_changes_tenant_created_idx" ON "applied_changes" USING btree ("tenant_id","created_at");--> statement-breakpoint
ALTER TABLE "bench_jobs" ADD CONSTRAINT "bench_jobs_technician_id_users_id_fk" FOREIGN KEY ("technician_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "bench_jobs_tenant_tech_day_idx" ON "bench_jobs" USING btree ("tenant_id","technician_id","planned_on","id") WHERE state = 'in_progress' and technician_id is not null;--> statement-breakpoint
CREATE POLICY "tenant_isolation" ON "game_meters" AS PERMISSIVE FOR ALL TO public USING ("game_meters"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid) WITH CHECK ("game_meters"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid);--> statement-breakpoint
CREATE POLICY "tenant_isolation" ON "meter_readings" AS PERMISSIVE FOR ALL TO public USING ("meter_readings"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid) WITH CHECK ("meter_readings"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid);--> statement-breakpoint
CREATE POLICY "tenant_isolation" ON "care_plans" AS PERMISSIVE FOR ALL TO public USING ("care_plans"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid) WITH CHECK ("care_plans"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid);--> statement-breakpoint
CREATE POLICY "tenant_isolation" ON "work_orders" AS PERMISSIVE FOR ALL TO public USING ("work_orders"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid) WITH CHECK ("work_orders"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid);--> statement-breakpoint
CREATE POLICY "tenant_isolation" ON "catalogue_parts" AS PERMISSIVE FOR ALL TO public USING ("catalogue_parts"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid) WITH CHECK ("catalogue_parts"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid);--> statement-breakpoint
CREATE POLICY "tenant_isolation" ON "part_fits" AS PERMISSIVE FOR ALL TO public USING ("part_fits"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid) WITH CHECK ("part_fits"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid);--> statement-breakpoint
CREATE POLICY "tenant_isolation" ON "parts_used" AS PERMISSIVE FOR ALL TO public USING ("parts_used"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid) WITH CHECK ("parts_used"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid);--> statement-breakpoint
CREATE POLICY "tenant_isolation" ON "stock_levels" AS PERMISSIVE FOR ALL TO public USING ("stock_levels"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid) WITH CHECK ("stock_levels"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid);--> statement-breakpoint
CREATE POLICY "tenant_isolation" ON "stock_locations" AS PERMISSIVE FOR ALL TO public USING ("stock_locations"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid) WITH CHECK ("stock_locations"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid);--> statement-breakpoint
CREATE POLICY "tenant_isolation" ON "stock_movements" AS PERMISSIVE FOR ALL TO public USING ("stock_movements"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid) WITH CHECK ("stock_movements"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid);--> statement-breakpoint
CREATE POLICY "tenant_isolation" ON "keep_cost_entries" AS PERMISSIVE FOR ALL TO public USING ("keep_cost_entries"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid) WITH CHECK ("keep_cost_entries"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid);--> statement-breakpoint
CREATE POLICY "tenant_isolation" ON "applied_changes" AS PERMISSIVE FOR ALL TO public USING ("applied_changes"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid) WITH CHECK ("applied_changes"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid);--> statement-breakpoint
CREATE POLICY "tenant_isolation" ON "route_days" AS PERMISSIVE FOR ALL TO public USING ("route_days"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid) WITH CHECK ("route_days"."tenant_id" = nullif(current_setting('app.tenant_id', true), '')::uuid);