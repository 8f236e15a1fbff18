-- Scheduled jobs find the companies that have due work with one indexed query across companies, instead of
-- visiting every company on every tick: idle cost stays flat however many companies there are. Each function
-- returns company ids only; the job then works inside each of those companies' row-level-security scope.
-- The partial indexes hold only rows that may become due, so history (sent messages, warned or finished
-- calls) is never read.
--
-- Outbox rows a worker may claim: pending, or 'sending' (a live claim, or one a dead process left behind).
CREATE INDEX "outbox_claimable_idx" ON "outbox" USING btree ("next_attempt_at", "tenant_id") WHERE status in ('pending', 'sending');--> statement-breakpoint
CREATE FUNCTION outbox_due_tenant_ids(p_now timestamptz, p_stuck_before timestamptz)
RETURNS TABLE (tenant_id uuid)
LANGUAGE sql STABLE SECURITY DEFINER SET search_path = public, pg_temp AS $$
  SELECT DISTINCT o.tenant_id FROM outbox o
  WHERE o.status in ('pending', 'sending') AND o.next_attempt_at <= p_now
    AND (o.status = 'pending' OR o.claimed_at < p_stuck_before)
$$;--> statement-breakpoint
-- Calls nobody has reached yet (callStateGroups.awaitingArrival in packages/contracts/src/calls.ts; a test
-- checks the two agree) and nobody has been warned about.
CREATE INDEX "service_calls_unwarned_target_idx" ON "service_calls" USING btree ("target_at", "tenant_id") WHERE warned_at IS NULL AND state in ('reported', 'assigned', 'on_the_way');--> statement-breakpoint
-- p_longest_lead (the longest warning lead settings allow) bounds the index range; the company's own lead,
-- read by key for those few calls only, then decides. A company without a settings row yet is returned when
-- a call is within the longest lead: the job reads its settings (made with their defaults) and decides.
CREATE FUNCTION warning_due_tenant_ids(p_now timestamptz, p_longest_lead interval)
RETURNS TABLE (tenant_id uuid)
LANGUAGE sql STABLE SECURITY DEFINER SET search_path = public, pg_temp AS $$
  SELECT DISTINCT c.tenant_id FROM service_calls c
  WHERE c.warned_at IS NULL AND c.state in ('reported', 'assigned', 'on_the_way')
    AND c.target_at <= p_now + p_longest_lead
    AND c.target_at <= p_now + coalesce(
      (SELECT s.warn_before_minutes * interval '1 minute' FROM tenant_settings s WHERE s.tenant_id = c.tenant_id),
      p_longest_lead)
$$;--> statement-breakpoint
-- Replaced by the two above; no caller is left.
DROP FUNCTION list_tenant_ids();--> statement-breakpoint
REVOKE ALL ON FUNCTION outbox_due_tenant_ids(timestamptz, timestamptz), warning_due_tenant_ids(timestamptz, interval) FROM public;--> statement-breakpoint
GRANT EXECUTE ON FUNCTION outbox_due_tenant_ids(timestamptz, timestamptz), warning_due_tenant_ids(timestamptz, interval) TO bumperline_app;
