// The shell every public game-tag page shares: small, readable on an old phone, kept out of search engines
// (the links carry secrets), and free of anything that would name the operator company.
import { markup, trusted, type SafeHtml } from './html.ts';
import { PUBLIC_CSS } from './styles.ts';

export interface PageOptions {
  title: string;
  body: SafeHtml;
  /** Seconds after which the browser reloads the page by itself (the status page), without JavaScript. */
  refreshSeconds?: number;
  /** Path of a small static script that only enhances the page; the page works without it. */
  script?: string;
}

export function page(o: PageOptions): string {
  return markup`<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width,initial-scale=1">
<meta name="robots" content="noindex,nofollow">
${o.refreshSeconds ? markup`<meta http-equiv="refresh" content="${o.refreshSeconds}">` : ''}
<title>${o.title}</title>
<style>${trusted(PUBLIC_CSS)}</style>
${o.script ? markup`<script src="${o.script}" defer></script>` : ''}
</head>
<body>
<main>
${o.body}
</main>
<footer><p>Game tag by Bumperline · no sign-in needed</p></footer>
</body>
</html>
`.value;
}
