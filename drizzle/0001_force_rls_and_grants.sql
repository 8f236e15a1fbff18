-- drizzle-kit cannot emit FORCE ROW LEVEL SECURITY: without it the tables' owner would bypass the policies.
ALTER TABLE "tenants" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "memberships" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "invitations" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "venues" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "game_models" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "games" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
ALTER TABLE "audit_log" FORCE ROW LEVEL SECURITY;--> statement-breakpoint
-- The API's role owns nothing and may only read and write rows; the policies decide which.
GRANT USAGE ON SCHEMA public TO bumperline_app;--> statement-breakpoint
GRANT SELECT, INSERT, UPDATE, DELETE ON ALL TABLES IN SCHEMA public TO bumperline_app;--> statement-breakpoint
GRANT USAGE, SELECT ON ALL SEQUENCES IN SCHEMA public TO bumperline_app;--> statement-breakpoint
ALTER DEFAULT PRIVILEGES IN SCHEMA public GRANT SELECT, INSERT, UPDATE, DELETE ON TABLES TO bumperline_app;--> statement-breakpoint
ALTER DEFAULT PRIVILEGES IN SCHEMA public GRANT USAGE, SELECT ON SEQUENCES TO bumperline_app;--> statement-breakpoint
-- The audit log is append-only for the API.
REVOKE UPDATE, DELETE ON "audit_log" FROM bumperline_app;--> statement-breakpoint
-- An invitation link names no company: this function, run as the owner, finds the one invitation
-- whose token hash matches and nothing else.
CREATE FUNCTION invitation_by_token_hash(p_token_hash text)
RETURNS TABLE (tenant_id uuid, id uuid, email text, role member_role, expires_at timestamptz, accepted_at timestamptz, revoked_at timestamptz, tenant_name text)
LANGUAGE sql STABLE SECURITY DEFINER SET search_path = public, pg_temp AS $$
  SELECT i.tenant_id, i.id, i.email, i.role, i.expires_at, i.accepted_at, i.revoked_at, t.name
  FROM invitations i JOIN tenants t ON t.id = i.tenant_id
  WHERE i.token_hash = p_token_hash
$$;--> statement-breakpoint
REVOKE ALL ON FUNCTION invitation_by_token_hash(text) FROM public;--> statement-breakpoint
GRANT EXECUTE ON FUNCTION invitation_by_token_hash(text) TO bumperline_app;
