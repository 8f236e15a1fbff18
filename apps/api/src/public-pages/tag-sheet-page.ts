// A venue's printable sheet of game tags: eight stickers to a page (2 × 4), sized to fit both A4 and
// Letter, each with a QR code of the game's report page, the game's title and serial, and one plain line.
import QRCode from 'qrcode';
import { escapeHtml, markup, trusted, type SafeHtml } from './html.ts';

export interface SheetTag {
  title: string;
  serial: string;
  url: string;
}

const PER_PAGE = 8;

/**
 * The QR code of a tag's address as inline SVG (crisp at any print size, and allowed by the CSP).
 * Error correction Q: a sticker on a bar cabinet gets scratched and sticky.
 */
export async function tagQrSvg(url: string): Promise<string> {
  const svg = await QRCode.toString(url, { type: 'svg', errorCorrectionLevel: 'Q', margin: 2 });
  return svg.replace('<svg ', `<svg role="img" aria-label="${escapeHtml(`QR code for ${url}`)}" `);
}

const CSS = `
@page{size:auto;margin:10mm}
*{box-sizing:border-box}
body{margin:0;background:#f4f6fa;color:#14213d;font:11pt/1.35 system-ui,-apple-system,"Segoe UI",Roboto,sans-serif}
.intro{max-width:190mm;margin:8mm auto 6mm;padding:0 2mm}
.intro h1{margin:0 0 2mm;font-size:16pt}
.intro p{margin:0 0 2mm;color:#3d4a66}
.sheet{display:grid;grid-template-columns:1fr 1fr;grid-auto-rows:62mm;width:190mm;margin:0 auto 8mm;background:#fff}
.sheet+.sheet{break-before:page}
.tag{display:flex;align-items:center;gap:4mm;padding:4mm;border:1px dashed #8792a8;break-inside:avoid}
.tag svg{flex:none;width:44mm;height:44mm}
.text{min-width:0}
.title{margin:0 0 1mm;font-size:12pt;font-weight:700;line-height:1.2}
.serial{margin:0 0 3mm;font-size:9pt;color:#3d4a66;font-variant-numeric:tabular-nums}
.ask{margin:0 0 2mm;padding-top:2mm;border-top:2px solid #d4a017;font-weight:700}
.url{margin:0;font-size:6.5pt;color:#3d4a66;word-break:break-all}
@media print{body{background:#fff}.intro{display:none}.sheet{margin:0 auto}}
`;

export async function tagSheetPage(p: { venueName: string; tags: SheetTag[] }): Promise<string> {
  const cells: SafeHtml[] = [];
  for (const t of p.tags) {
    cells.push(markup`<div class="tag">
${trusted(await tagQrSvg(t.url))}
<div class="text">
<p class="title">${t.title}</p>
<p class="serial">Serial ${t.serial}</p>
<p class="ask">Game not working? Scan to tell us.</p>
<p class="url">${t.url}</p>
</div>
</div>`);
  }
  const pages: SafeHtml[][] = [];
  for (let i = 0; i < cells.length; i += PER_PAGE) pages.push(cells.slice(i, i + PER_PAGE));
  const n = p.tags.length;
  const intro = n
    ? markup`<p>${n} game${n === 1 ? '' : 's'} on location. Print on A4 or Letter at 100% scale (Ctrl+P, or ⌘P on a Mac), cut along the dashed lines, and stick each tag on its own cabinet.</p>
<p>A tag that was replaced stops working at once; print the new one.</p>`
    : markup`<p>There are no games on location at this venue, so there are no tags to print.</p>`;

  return markup`<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width,initial-scale=1">
<title>Game tags · ${p.venueName}</title>
<style>${trusted(CSS)}</style>
</head>
<body>
<header class="intro">
<h1>Game tags · ${p.venueName}</h1>
${intro}
</header>
${pages.map((cellsOnPage) => markup`<section class="sheet">${cellsOnPage}</section>`)}
</body>
</html>
`.value;
}
