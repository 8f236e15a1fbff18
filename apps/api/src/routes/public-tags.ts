// The public game-tag pages: the report form a QR tag opens (/t/:token), its receipt, and the status
// page of a report (/status/:token). No sign-in: a tag or status token names no company, so each
// request finds its company through a narrow SECURITY DEFINER lookup and then works inside that
// company's row-level-security scope. Plain HTML forms, so an old phone with JavaScript off can report.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { Router, type Request, type Response } from 'express';
import { rateLimit, type Options as RateLimitOptions } from 'express-rate-limit';
import type { z } from 'zod';
import { callRef, problemLabels, type CallState } from '@bumperline/contracts/calls';
import { publicReportInput } from '@bumperline/contracts/public-report';
import { withScope, type Db } from '@bumperline/db/client';
import { findCallByStatusToken, getCall, getCallRow } from '@bumperline/db/queries/calls';
import { listEvents } from '@bumperline/db/queries/call-events';
import { getCompanyLocale } from '@bumperline/db/queries/companies';
import { findGameByTag, type TaggedGame } from '@bumperline/db/queries/game-tags';
import { InvalidInput } from '../services/workflow-errors.ts';
import { openCall } from '../services/service-calls.ts';
import type { PhotoStore } from '../services/photo-store.ts';
import { CounterStore, postgresCounter } from '../http/rate-limit-counter.ts';
import { appLink } from '../services/links.ts';
import { multipartForm, PHOTO_MAX_BYTES, PhotoRejected, preparePhoto, savePhoto, type PreparedPhoto } from '../services/photo-intake.ts';
import { reportPage, type ReportErrors, type ReportField, type ReportValues } from '../public-pages/report-page.ts';
import { receiptPage, type SmsOutcome } from '../public-pages/receipt-page.ts';
import { statusPage } from '../public-pages/status-page.ts';
import { inactiveTag, somethingWentWrong, tooManyReports, unknownStatus } from '../public-pages/notice-page.ts';

export interface ReportLimit {
  max: number;
  windowMs: number;
}
export interface ReportLimits {
  /** Reports for one game tag, from anyone: stops a flood on one cabinet. */
  perTag: ReportLimit;
  /** Reports from one client address, for any tag: stops one sender flooding many cabinets. */
  perAddress: ReportLimit;
}
/** Common-practice values: a dead game draws a few reports, not dozens. */
export const DEFAULT_REPORT_LIMITS: ReportLimits = {
  perTag: { max: 5, windowMs: 10 * 60_000 },
  perAddress: { max: 20, windowMs: 60 * 60_000 },
};

const NOTE_MAX = 1000;
const REPORTER = 'Reporter (game tag)';
// Tokens are base64url; anything else cannot be one, so it never reaches the database.
const TOKEN = /^[A-Za-z0-9_-]{16,64}$/;
const SCRIPT = readFileSync(path.join(path.dirname(fileURLToPath(import.meta.url)), '../public-pages/report.js'));

async function findActiveTag(db: Db, token: string): Promise<TaggedGame | undefined> {
  if (!TOKEN.test(token)) return undefined;
  const tag = await findGameByTag(db, token);
  return tag && !tag.retired ? tag : undefined;
}

async function findCallByStatus(db: Db, token: string): Promise<{ tenantId: string; callId: string } | undefined> {
  if (!TOKEN.test(token)) return undefined;
  return findCallByStatusToken(db, token);
}

/**
 * A failure on these pages shows a plain page, never an error dump or JSON. (Not a router-level error
 * handler: this router sits at the root, where it would also catch other routers' errors.)
 */
function htmlPage(handler: (req: Request, res: Response) => Promise<void>) {
  return async (req: Request, res: Response) => {
    try {
      await handler(req, res);
    } catch (err) {
      req.log?.error({ err }, 'public game-tag page failed');
      if (!res.headersSent) send(res, 500, somethingWentWrong());
    }
  };
}

function send(res: Response, status: number, body: string) {
  // These pages carry secrets in their address and change as the repair moves on: never cached, never indexed.
  res.status(status).type('html').set({ 'Cache-Control': 'no-store', 'X-Robots-Tag': 'noindex, nofollow' }).send(body);
}

const str = (v: unknown) => (typeof v === 'string' ? v : undefined);
// Our tokens are base64url; anything else (a NUL, a space, a novel) cannot be one, so it is looked up as ''.
const asToken = (v: unknown) => {
  const t = str(v) ?? '';
  return /^[A-Za-z0-9_-]{1,100}$/.test(t) ? t : '';
};
const tokenOf = (req: Request) => asToken(req.params.token);

type Issue = z.core.$ZodIssue;

/** The phone field is "empty or a number": its useful message sits inside the union's failed branches. */
function innermostMessage(issue: Issue): string {
  if (issue.code !== 'invalid_union') return issue.message;
  const branch = issue.errors.flat().find((i) => i.code === 'custom' || i.code === 'too_big');
  return branch?.message ?? issue.message;
}

/** The zod issues of publicReportInput as sentences to show beside each field. */
function reportErrors(issues: Issue[]): ReportErrors {
  const errors: ReportErrors = {};
  for (const issue of issues) {
    const field = String(issue.path[0] ?? '');
    if (issue.code === 'unrecognized_keys')
      errors.form = `The form had fields we do not know (${issue.keys.join(', ')}). Please use the form on this page.`;
    else if (field === 'problem') errors.problem = 'Choose what is wrong with the game.';
    else if (field === 'note') errors.note = `Your note ${issue.message}.`;
    else if (field === 'phone') errors.phone = `The mobile number ${innermostMessage(issue)}.`;
    else if (field === 'smsConsent') errors.smsConsent = 'Tick the box only if you want text updates.';
    else errors.form = 'Some of the form could not be read. Please send it again.';
  }
  return errors;
}

function tooMany(windowMs: number): RateLimitOptions['handler'] {
  return (req, res) => {
    const info = (req as Request & { reportLimit?: { resetTime?: Date } }).reportLimit;
    const msLeft = info?.resetTime ? info.resetTime.getTime() - Date.now() : windowMs;
    send(res, 429, tooManyReports(Math.max(1, Math.ceil(msLeft / 60_000))));
  };
}

export function publicTagsRouter(deps: { db: Db; photos: PhotoStore; appOrigin: string; limits?: Partial<ReportLimits> }): Router {
  const { db, photos, appOrigin } = deps;
  const limits = { ...DEFAULT_REPORT_LIMITS, ...deps.limits };
  const r = Router();

  const limiterBase = { standardHeaders: 'draft-8', legacyHeaders: false, requestPropertyName: 'reportLimit' } as const;
  // Counted in PostgreSQL, so a flood is stopped whichever API instance it reaches.
  const counter = postgresCounter(db);
  const byAddress = rateLimit({
    ...limiterBase,
    store: new CounterStore(counter, 'report-address'),
    windowMs: limits.perAddress.windowMs,
    limit: limits.perAddress.max,
    handler: tooMany(limits.perAddress.windowMs),
  });
  const byTag = rateLimit({
    ...limiterBase,
    store: new CounterStore(counter, 'report-tag'),
    windowMs: limits.perTag.windowMs,
    limit: limits.perTag.max,
    keyGenerator: (req) => `tag:${tokenOf(req)}`,
    handler: tooMany(limits.perTag.windowMs),
  });
  const readForm = multipartForm({
    fileField: 'photo',
    maxBytes: PHOTO_MAX_BYTES,
    fieldLabels: { note: 'Your note', phone: 'The mobile number' },
  });

  const formPage = (tag: TaggedGame, token: string, extra: { values?: ReportValues; errors?: ReportErrors; photoNotKept?: boolean } = {}) =>
    reportPage({
      game: { title: tag.title, venueName: tag.venueName },
      action: `/t/${encodeURIComponent(token)}`,
      maxPhotoMb: PHOTO_MAX_BYTES / (1024 * 1024),
      noteMax: NOTE_MAX,
      ...extra,
    });

  r.get('/t-assets/report.js', (_req, res) => {
    res.type('application/javascript').set('Cache-Control', 'public, max-age=3600').send(SCRIPT);
  });

  r.get(
    '/t/:token',
    htmlPage(async (req, res) => {
      const token = tokenOf(req);
      const tag = await findActiveTag(db, token);
      if (!tag) return send(res, 404, inactiveTag());
      send(res, 200, formPage(tag, token));
    }),
  );

  r.post(
    '/t/:token',
    byAddress,
    byTag,
    htmlPage(async (req, res) => {
      const token = tokenOf(req);
      const tag = await findActiveTag(db, token);
      if (!tag) return send(res, 404, inactiveTag());

      const form = await readForm(req, res);
      const body = (req.body ?? {}) as Record<string, unknown>;
      const values: ReportValues = {
        problem: str(body.problem),
        note: str(body.note),
        phone: str(body.phone),
        smsConsent: !!body.smsConsent,
      };
      const hadPhoto = !!form.file && form.file.size > 0;
      const again = (status: number, errors: ReportErrors) =>
        send(res, status, formPage(tag, token, { values, errors, photoNotKept: hadPhoto }));

      if (form.problem) {
        const field = (['note', 'phone', 'photo'].includes(form.problem.field) ? form.problem.field : 'form') as ReportField;
        return send(res, form.problem.status, formPage(tag, token, { values, errors: { [field]: form.problem.message } }));
      }
      const parsed = publicReportInput.safeParse(body);
      if (!parsed.success) return again(400, reportErrors(parsed.error.issues));
      const input = parsed.data;
      if (input.smsConsent && !input.phone) {
        return again(400, { phone: 'Enter a mobile number for text updates, or untick the box below.' });
      }

      // Photo work happens before any database work, so a photo we refuse leaves nothing behind.
      let photo: PreparedPhoto | undefined;
      if (hadPhoto) {
        try {
          photo = await preparePhoto(form.file!.buffer);
        } catch (err) {
          if (err instanceof PhotoRejected) return send(res, 400, formPage(tag, token, { values, errors: { photo: err.message } }));
          throw err;
        }
      }

      let opened;
      const written: string[] = [];
      try {
        opened = await withScope(db, { tenantId: tag.tenantId }, async (tx) => {
          const call = await openCall(tx, {
            gameId: tag.gameId,
            problem: input.problem,
            note: input.note,
            source: 'game_tag',
            reporterPhone: input.phone || null,
            smsConsent: input.smsConsent,
            actor: { userId: null, role: null, label: REPORTER },
            appOrigin,
          });
          if (photo) await savePhoto(tx, photos, { callId: call.callId, photo, uploadedBy: 'reporter', actorLabel: REPORTER, written });
          const row = await getCallRow(tx, call.callId);
          return { ...call, textsToThisPhone: !!input.phone && row?.reporterPhone === input.phone && row.reporterSmsConsent };
        });
      } catch (err) {
        // Nothing of a report that was not saved may stay on disk.
        await Promise.all(written.map((key) => photos.remove(key).catch(() => {})));
        // The game was retired between the lookup and the report.
        if (err instanceof InvalidInput) return send(res, 404, inactiveTag());
        throw err;
      }

      const sms: SmsOutcome = !input.phone ? 'none' : !input.smsConsent ? 'not-kept' : opened.textsToThisPhone ? 'on' : 'taken';
      const query = new URLSearchParams({ call: opened.statusToken, sms, ...(opened.joined ? { joined: '1' } : {}) });
      res.redirect(303, `/t/${encodeURIComponent(token)}/thanks?${query}`);
    }),
  );

  r.get(
    '/t/:token/thanks',
    htmlPage(async (req, res) => {
      const tag = await findActiveTag(db, tokenOf(req));
      const found = await findCallByStatus(db, asToken(req.query.call));
      if (!tag || !found || found.tenantId !== tag.tenantId) return send(res, 404, unknownStatus());
      const call = await withScope(db, { tenantId: found.tenantId }, (tx) => getCall(tx, found.callId));
      if (!call || call.gameId !== tag.gameId) return send(res, 404, unknownStatus());
      const statusPath = `/status/${encodeURIComponent(str(req.query.call)!)}`;
      const sms = str(req.query.sms);
      send(
        res,
        200,
        receiptPage({
          game: { title: call.gameTitle, venueName: call.venueName },
          ref: callRef(call.id),
          statusPath,
          statusUrl: appLink(appOrigin, statusPath),
          joined: req.query.joined === '1',
          sms: sms === 'on' || sms === 'taken' || sms === 'not-kept' ? sms : 'none',
        }),
      );
    }),
  );

  r.get(
    '/status/:token',
    htmlPage(async (req, res) => {
      const found = await findCallByStatus(db, tokenOf(req));
      if (!found) return send(res, 404, unknownStatus());
      const view = await withScope(db, { tenantId: found.tenantId }, async (tx) => {
        const call = await getCall(tx, found.callId);
        if (!call) return undefined;
        const company = await getCompanyLocale(tx, found.tenantId);
        return { call, events: await listEvents(tx, call.id), timeZone: company?.timeZone ?? 'UTC', locale: company?.locale ?? 'en-US' };
      });
      if (!view) return send(res, 404, unknownStatus());

      const when = timeFormatter(view.locale, view.timeZone);
      // Only the state changes, never who made them or what they wrote.
      const timeline: { state: CallState; at: string; iso: string }[] = [];
      for (const e of view.events) {
        if (!e.toState || timeline.at(-1)?.state === e.toState) continue;
        timeline.push({ state: e.toState, at: when.format(e.at), iso: e.at.toISOString() });
      }
      send(
        res,
        200,
        statusPage({
          game: { title: view.call.gameTitle, venueName: view.call.venueName },
          ref: callRef(view.call.id),
          problemLabel: problemLabels[view.call.problem],
          state: view.call.state,
          timeline,
          checkedAt: when.format(new Date()),
        }),
      );
    }),
  );

  return r;
}

/** Times in the operator's own time zone and locale, with the zone named so a visitor is never misled. */
function timeFormatter(locale: string, timeZone: string): Intl.DateTimeFormat {
  const options: Intl.DateTimeFormatOptions = {
    weekday: 'short',
    month: 'short',
    day: 'numeric',
    hour: 'numeric',
    minute: '2-digit',
    timeZoneName: 'short',
  };
  try {
    return new Intl.DateTimeFormat(locale, { ...options, timeZone });
  } catch {
    return new Intl.DateTimeFormat('en-US', { ...options, timeZone: 'UTC' });
  }
}
