// /dev/phone, mounted only while the local SMS fake stands in for the provider: every text the app sent
// and received, one conversation per phone number, and a form to text the app as any number (to answer
// an assignment with YES or NO, or to send STOP). /dev/phone.json gives the same to tests.
import express, { Router, type RequestHandler } from 'express';
import type { FakeMessage, SmsFake } from '@bumperline/fakes/sms/sms-fake';
import { devPhoneReplyInput } from '@bumperline/contracts/dev-phone';
import { hostOf } from '../http/csrf.ts';
import { HttpError } from '../http/errors.ts';
import { refuseNulBytes } from '../http/nul-bytes.ts';
import { parse } from '../http/validate.ts';

const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
// Links in texts (status pages, calls) open; the URL is escaped before it becomes an attribute.
const linkify = (s: string) => escapeHtml(s).replace(/(https?:\/\/[^\s<"']+)/g, '<a href="$1">$1</a>');
const anchorOf = (phone: string) => `phone-${phone.replace(/\D/g, '')}`;

const DIRECTION: Record<FakeMessage['direction'], string> = {
  'outbound-api': 'Sent by Bumperline',
  'outbound-reply': 'Automatic reply',
  inbound: 'Texted by this phone',
};

/** A form post from another site must not text the app in someone's name, even in development. */
const sameOriginOnly: RequestHandler = (req, _res, next) => {
  const origin = req.headers.origin;
  if (origin !== undefined && hostOf(origin) !== req.headers.host) {
    throw new HttpError(403, 'Cross-site request refused', 'This form can only be sent from this page.', undefined, 'csrf');
  }
  next();
};

function replyForm(base: string, idSuffix: string, phone?: string): string {
  const fromField = phone
    ? `<input type="hidden" name="from" value="${escapeHtml(phone)}">`
    : `<p><label for="from-${idSuffix}">Phone number</label>
<input id="from-${idSuffix}" name="from" type="tel" autocomplete="off" required placeholder="+13125550142"></p>`;
  return `<form method="post" action="${escapeHtml(base)}/phone/reply" class="reply">${fromField}
<p><label for="body-${idSuffix}">${phone ? `Reply as ${escapeHtml(phone)}` : 'Message'}</label>
<textarea id="body-${idSuffix}" name="body" rows="2" maxlength="1600" required></textarea></p>
<p><button type="submit">Send text</button></p></form>`;
}

function messageItem(m: FakeMessage): string {
  const status = m.errorCode ? `${m.status}, error ${m.errorCode}` : m.status;
  return `<li class="${m.direction === 'inbound' ? 'in' : 'out'}"><p class="meta"><strong>${DIRECTION[m.direction]}</strong>
· <time datetime="${m.dateCreated.toISOString()}">${escapeHtml(m.dateCreated.toLocaleString('en-US'))}</time> · ${escapeHtml(status)}</p>
<p class="body">${linkify(m.body)}</p></li>`;
}

function page(base: string, messages: FakeMessage[]): string {
  // One conversation per phone (the other end from our number), the most recently active first.
  const threads = new Map<string, FakeMessage[]>();
  for (const m of messages) {
    const phone = m.direction === 'inbound' ? m.from : m.to;
    threads.set(phone, [...(threads.get(phone) ?? []), m]);
  }
  const sections = [...threads.entries()]
    .map(
      ([phone, list], i) => `<section aria-labelledby="${anchorOf(phone)}"><h2 id="${anchorOf(phone)}">${escapeHtml(phone)}</h2>
<ol class="thread">${list.map(messageItem).join('')}</ol>${replyForm(base, String(i), phone)}</section>`,
    )
    .join('');
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">
<title>Development phone · Bumperline development</title>
<style>body{font-family:system-ui,sans-serif;max-width:48rem;margin:2rem auto;padding:0 1rem;color:#111827;background:#f8fafc;line-height:1.45}
h1{font-size:1.4rem}h2{font-size:1.1rem;margin:0 0 .5rem}section,.new{background:#fff;border:1px solid #94a3b8;border-radius:.5rem;padding:1rem;margin:1rem 0}
ol.thread{list-style:none;margin:0;padding:0}ol.thread li{border-left:4px solid #1e3a8a;padding:.25rem .75rem;margin:.5rem 0}ol.thread li.in{border-left-color:#166534;background:#f0fdf4}
.meta{margin:0;color:#374151;font-size:.9rem}.body{margin:.25rem 0;white-space:pre-wrap;overflow-wrap:anywhere}a{color:#1d4ed8}
label{display:block;font-weight:600;margin-bottom:.25rem}input,textarea{font:inherit;width:100%;box-sizing:border-box;padding:.5rem;border:1px solid #475569;border-radius:.375rem}
button{font:inherit;font-weight:600;padding:.5rem 1rem;min-height:2.75rem;border:0;border-radius:.375rem;background:#1e3a8a;color:#fff;cursor:pointer}
:focus-visible{outline:3px solid #b45309;outline-offset:2px}</style></head>
<body><main><h1>Development phone</h1>
<p>Texts the app sent and received while the local SMS fake stands in for the provider, newest first. Text the app as any
number: a technician answers an assignment with YES or NO; anyone can send STOP, START or HELP. <a href="${escapeHtml(base)}/phone">Refresh</a></p>
<div class="new"><h2>Text the app</h2>${replyForm(base, 'new')}</div>
${sections || '<p>No texts yet.</p>'}</main></body></html>`;
}

export function devPhoneRouter(fake: SmsFake): Router {
  const r = Router();
  r.get('/phone.json', (_req, res) => {
    res.json({ messages: fake.messages() });
  });
  r.get('/phone', (req, res) => {
    // With the app-wide "no-referrer" policy a browser posts this page's form with `Origin: null`, which
    // the same-origin check refuses; "same-origin" lets it send the real origin to this same site.
    res.setHeader('Referrer-Policy', 'same-origin');
    res.type('html').send(page(req.baseUrl, fake.messages()));
  });
  r.post('/phone/reply', sameOriginOnly, express.urlencoded({ extended: false, limit: '10kb' }), refuseNulBytes, async (req, res) => {
    const { from, body } = parse(devPhoneReplyInput, req.body ?? {});
    await fake.reply(from, body);
    res.redirect(303, `${req.baseUrl}/phone#${anchorOf(from)}`);
  });
  return r;
}
