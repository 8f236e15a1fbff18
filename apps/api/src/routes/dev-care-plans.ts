// /dev/care-plans (demo mode, loopback only): the demo's clock for care plans. Runs the care-plan run as of a chosen
// moment, so a walk-through can "advance the clock" and watch due work appear. /dev/care-plans/run answers JSON to
// tests (POST {"at": ISO date-time}) and the form on the page.
import express, { Router, type RequestHandler } from 'express';
import type { Db } from '@bumperline/db/client';
import { devCarePlanRun, type CarePlanRunResult } from '@bumperline/contracts/work-orders';
import { hostOf } from '../http/csrf.ts';
import { HttpError } from '../http/errors.ts';
import { refuseNulBytes } from '../http/nul-bytes.ts';
import { parse } from '../http/validate.ts';
import { runCarePlansOnce } from '../jobs/care-plan-run.ts';

const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

/** A form post from another site must not run jobs, even in development. */
const sameOriginOnly: RequestHandler = (req, _res, next) => {
  const origin = req.headers.origin;
  if (origin !== undefined && hostOf(origin) !== req.headers.host) {
    throw new HttpError(403, 'Cross-site request refused', 'This form can only be sent from this page.', undefined, 'csrf');
  }
  next();
};

function page(base: string, result?: CarePlanRunResult): string {
  const outcome = result
    ? `<p role="status"><strong>Ran as of ${escapeHtml(new Date(result.at).toUTCString())}:</strong> ${result.companies} companies, ${result.plansChecked} plans checked, ${result.workOrdersCreated} work orders created.</p>`
    : '';
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">
<title>Care-plan clock · Bumperline development</title>
<style>body{font-family:system-ui,sans-serif;max-width:40rem;margin:2rem auto;padding:0 1rem;color:#111827;background:#f8fafc}
label{display:block;font-weight:600;margin:.5rem 0}input,button{font:inherit;padding:.5rem .75rem;min-height:2.75rem}
button{background:#1e3a8a;color:#fff;border:0;border-radius:.375rem;margin-top:.75rem}[role=status]{background:#ecfdf5;border:1px solid #047857;padding:.75rem;border-radius:.375rem}</style></head>
<body><main><h1>Care-plan clock (development only)</h1>
<p>Runs the scheduled care-plan run as if it were the moment you choose (UTC): every plan past its next check looks at its games and makes work orders for work due by then.</p>
${outcome}
<form method="post" action="${escapeHtml(base)}/care-plans/run"><label for="at">Run as of (UTC)</label>
<input id="at" name="at" type="datetime-local" required value="${new Date().toISOString().slice(0, 16)}">
<button type="submit">Run the care-plan run</button></form></main></body></html>`;
}

export function devCarePlansRouter(db: Db): Router {
  const r = Router();
  r.get('/care-plans', (req, res) => {
    // As on /dev/phone: "same-origin" lets the form's post carry this site's origin (not "null").
    res.setHeader('Referrer-Policy', 'same-origin');
    res.type('html').send(page(req.baseUrl));
  });
  r.post(
    '/care-plans/run',
    sameOriginOnly,
    express.json({ limit: '10kb' }),
    express.urlencoded({ extended: false, limit: '10kb' }),
    refuseNulBytes,
    async (req, res) => {
      const fromForm = req.is('application/x-www-form-urlencoded');
      const body = (req.body ?? {}) as { at?: unknown };
      // The page's datetime-local field has no zone: it is read as UTC, as the page says.
      const at = fromForm && typeof body.at === 'string' && /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/.test(body.at) ? `${body.at}:00Z` : body.at;
      const input = parse(devCarePlanRun, { at });
      const when = new Date(input.at);
      const ran = await runCarePlansOnce({ db }, when);
      const result: CarePlanRunResult = { at: when.toISOString(), ...ran };
      if (fromForm) res.setHeader('Referrer-Policy', 'same-origin').type('html').send(page(req.baseUrl, result));
      else res.json(result);
    },
  );
  return r;
}
