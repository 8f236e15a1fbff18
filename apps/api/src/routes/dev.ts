// Developer pages, mounted only while the local fakes stand in for hosted services.
import { Router } from 'express';
import type { MailFake } from '@bumperline/fakes/mail/mail-fake';

const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
const linkify = (s: string) => escapeHtml(s).replace(/(https?:\/\/[^\s<]+)/g, '<a href="$1">$1</a>');

export function devRouter(mail: MailFake): Router {
  const r = Router();
  r.get('/outbox.json', (_req, res) => {
    res.json({ messages: mail.messages() });
  });
  r.get('/outbox', (_req, res) => {
    const rows = mail
      .messages()
      .map(
        (m) =>
          `<article><header><h2>${escapeHtml(m.subject)}</h2><p>To ${escapeHtml(m.to.join(', '))} · ${escapeHtml(
            new Date(m.at).toLocaleString('en-US'),
          )}</p></header><pre>${linkify(m.text)}</pre></article>`,
      )
      .join('');
    res.type('html')
      .send(`<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">
<title>Captured e-mail · Bumperline development</title>
<style>body{font-family:system-ui,sans-serif;max-width:48rem;margin:2rem auto;padding:0 1rem;color:#111827;background:#f8fafc}
article{background:#fff;border:1px solid #cbd5e1;border-radius:.5rem;padding:1rem;margin:1rem 0}h1{font-size:1.4rem}h2{font-size:1.1rem;margin:0}
header p{margin:.25rem 0;color:#374151}pre{white-space:pre-wrap;overflow-wrap:anywhere;font-family:inherit}a{color:#1d4ed8}</style></head>
<body><main><h1>Captured e-mail (development only)</h1><p>Messages the app sent while the local mail fake stands in for SMTP, newest first.</p>
${rows || '<p>No messages yet.</p>'}</main></body></html>`);
  });
  return r;
}
