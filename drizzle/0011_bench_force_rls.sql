-- FORCE row-level security on the bench tables (drizzle-kit cannot emit it).
ALTER TABLE "model_boards" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "board_parts" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "board_instances" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "cabinet_profiles" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "part_readings" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "bench_templates" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "bench_jobs" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "bench_job_parts_used" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "bench_job_photos" FORCE ROW LEVEL SECURITY;
