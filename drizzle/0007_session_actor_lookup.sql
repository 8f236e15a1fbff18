-- Who is asking, in one statement: the live session, its person, whether they are an active platform
-- admin, and the company the session works in (the one it chose if they still belong to it, else their
-- first by name) with their role there. Every request runs it, so it replaces four round trips. It reads
-- memberships across companies, so it runs as the owner and returns only this one session's row.
CREATE FUNCTION session_actor(p_session_id uuid)
RETURNS TABLE (session_id uuid, user_id uuid, email text, name text, tenant_id uuid, role text, is_platform_admin boolean)
LANGUAGE sql STABLE SECURITY DEFINER SET search_path = public, pg_temp AS $$
  SELECT s.id, u.id, u.email, u.name, m.tenant_id, m.role, coalesce(pa.active, false)
  FROM user_sessions s
  JOIN users u ON u.id = s.user_id
  LEFT JOIN platform_admins pa ON pa.user_id = u.id
  LEFT JOIN LATERAL (
    SELECT mm.tenant_id, mm.role
    FROM memberships mm JOIN tenants t ON t.id = mm.tenant_id
    WHERE mm.user_id = u.id
    ORDER BY mm.tenant_id IS NOT DISTINCT FROM s.active_tenant_id DESC, t.name, t.id
    LIMIT 1
  ) m ON true
  WHERE s.id = p_session_id AND s.revoked_at IS NULL
$$;--> statement-breakpoint
REVOKE ALL ON FUNCTION session_actor(uuid) FROM public;--> statement-breakpoint
GRANT EXECUTE ON FUNCTION session_actor(uuid) TO bumperline_app;
