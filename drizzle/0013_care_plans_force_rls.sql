-- FORCE row-level security on the care-plan, meter, stock and route-day tables (drizzle-kit cannot emit it).
ALTER TABLE "game_meters" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "meter_readings" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "care_plans" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "work_orders" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "catalogue_parts" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "part_fits" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "stock_locations" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "stock_levels" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "stock_movements" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "parts_used" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "keep_cost_entries" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "route_days" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "applied_changes" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
-- A bench job's part fitted points at the catalogue (declared here: the two schema files would import each other).
ALTER TABLE "bench_job_parts_used" ADD CONSTRAINT "bench_job_parts_used_catalogue_part_fk" FOREIGN KEY ("tenant_id", "catalogue_part_id") REFERENCES "public"."catalogue_parts"("tenant_id", "id");
--> statement-breakpoint
-- The care-plan run finds the companies with a plan past its next check in one indexed query (as 0008 does for the
-- outbox and warnings); retired plans are never read.
CREATE INDEX "care_plans_next_check_idx" ON "care_plans" USING btree ("next_check_at", "tenant_id") WHERE retired_at IS NULL;--> statement-breakpoint
CREATE FUNCTION care_plan_due_tenant_ids(p_now timestamptz)
RETURNS TABLE (tenant_id uuid)
LANGUAGE sql STABLE SECURITY DEFINER SET search_path = public, pg_temp AS $$
  SELECT DISTINCT p.tenant_id FROM care_plans p WHERE p.retired_at IS NULL AND p.next_check_at <= p_now
$$;--> statement-breakpoint
REVOKE ALL ON FUNCTION care_plan_due_tenant_ids(timestamptz) FROM public;--> statement-breakpoint
GRANT EXECUTE ON FUNCTION care_plan_due_tenant_ids(timestamptz) TO bumperline_app;
