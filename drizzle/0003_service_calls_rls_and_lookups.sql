-- FORCE row-level security on the service-call tables (drizzle-kit cannot emit it).
ALTER TABLE "tenant_settings" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "venue_contacts" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "technician_profiles" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "service_calls" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "call_events" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "call_photos" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "downtime_intervals" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "outbox" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
-- Narrow lookups that start from something other than a signed-in company (a game tag, a status link,
-- a phone number, a provider's message id, a scheduled job). Each returns the owning company so the
-- caller can continue inside that company's row-level-security scope, and nothing more.
CREATE FUNCTION game_by_tag(p_token text)
RETURNS TABLE (tenant_id uuid, game_id uuid, title text, kind game_kind, venue_id uuid, venue_name text, retired boolean)
LANGUAGE sql STABLE SECURITY DEFINER SET search_path = public, pg_temp AS $$
  SELECT g.tenant_id, g.id, m.title, m.kind, g.venue_id, v.name, g.retired_at IS NOT NULL
  FROM games g
  JOIN game_models m ON m.tenant_id = g.tenant_id AND m.id = g.model_id
  LEFT JOIN venues v ON v.tenant_id = g.tenant_id AND v.id = g.venue_id
  WHERE g.tag_token = p_token
$$;--> statement-breakpoint
CREATE FUNCTION call_by_status_token(p_token text)
RETURNS TABLE (tenant_id uuid, call_id uuid)
LANGUAGE sql STABLE SECURITY DEFINER SET search_path = public, pg_temp AS $$
  SELECT c.tenant_id, c.id FROM service_calls c WHERE c.status_token = p_token
$$;--> statement-breakpoint
CREATE FUNCTION technicians_by_phone(p_phone text)
RETURNS TABLE (tenant_id uuid, user_id uuid)
LANGUAGE sql STABLE SECURITY DEFINER SET search_path = public, pg_temp AS $$
  SELECT m.tenant_id, m.user_id FROM users u JOIN memberships m ON m.user_id = u.id
  WHERE u.phone = p_phone AND m.role = 'technician'
$$;--> statement-breakpoint
CREATE FUNCTION outbox_by_provider_id(p_provider_id text)
RETURNS TABLE (tenant_id uuid, id uuid)
LANGUAGE sql STABLE SECURITY DEFINER SET search_path = public, pg_temp AS $$
  SELECT o.tenant_id, o.id FROM outbox o WHERE o.provider_id = p_provider_id
$$;--> statement-breakpoint
-- Scheduled jobs visit companies one by one, each inside its own scope.
CREATE FUNCTION list_tenant_ids()
RETURNS TABLE (tenant_id uuid)
LANGUAGE sql STABLE SECURITY DEFINER SET search_path = public, pg_temp AS $$
  SELECT t.id FROM tenants t ORDER BY t.id
$$;--> statement-breakpoint
REVOKE ALL ON FUNCTION game_by_tag(text), call_by_status_token(text), technicians_by_phone(text), outbox_by_provider_id(text), list_tenant_ids() FROM public;--> statement-breakpoint
GRANT EXECUTE ON FUNCTION game_by_tag(text), call_by_status_token(text), technicians_by_phone(text), outbox_by_provider_id(text), list_tenant_ids() TO bumperline_app;
