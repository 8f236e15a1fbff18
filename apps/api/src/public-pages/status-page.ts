// The public status of one service call: the game, where the repair stands in plain words, and when each
// step happened. Deliberately nothing else: no technician, no phone number, no staff notes.
import { callStateLabels, type CallState } from '@bumperline/contracts/calls';
import { markup } from './html.ts';
import { page } from './layout.ts';

export interface StatusPageParams {
  game: { title: string; venueName: string | null };
  ref: string;
  problemLabel: string;
  state: CallState;
  /** State changes, oldest first, with the time already written in the operator's time zone. */
  timeline: { state: CallState; at: string; iso: string }[];
  checkedAt: string;
}

type Tone = 'attention' | 'running' | 'neutral';

const tone: Record<CallState, Tone> = {
  reported: 'attention',
  assigned: 'attention',
  on_the_way: 'attention',
  on_site: 'attention',
  waiting_parts: 'attention',
  at_shop: 'attention',
  fixed: 'running',
  closed: 'running',
  cancelled: 'neutral',
};

const explanation: Record<CallState, string> = {
  reported: 'The operator has the report and will send a technician.',
  assigned: 'A technician has been given this repair.',
  on_the_way: 'A technician is on the way to the game.',
  on_site: 'A technician is at the game, working on it.',
  waiting_parts: 'The technician is waiting on parts for the game.',
  at_shop: 'The game, or a board from it, has been taken to the shop for repair.',
  fixed: 'The game has been fixed.',
  closed: 'This report is finished: the game was fixed.',
  cancelled: 'This report was closed without a repair, for example because the game was found working.',
};

const mark: Record<Tone, string> = { attention: '●', running: '✓', neutral: '■' };

export function statusPage(p: StatusPageParams): string {
  const t = tone[p.state];
  const steps = p.timeline.map((s) => markup`<li><span>${callStateLabels[s.state]}</span> <time datetime="${s.iso}">${s.at}</time></li>`);
  const body = markup`
<p class="kicker">Repair status</p>
<h1>${p.game.title}</h1>
<p class="where">${p.game.venueName ? `at ${p.game.venueName}` : ''}</p>
<div class="card">
<p><span class="badge s-${t}"><span aria-hidden="true">${mark[t]}</span> ${callStateLabels[p.state]}</span></p>
<p>${explanation[p.state]}</p>
<p class="hint">Problem reported: ${p.problemLabel} · Reference ${p.ref}</p>
</div>
<h2>Steps so far</h2>
<ol class="timeline">
${steps}
</ol>
<p class="hint">Checked ${p.checkedAt}. This page refreshes itself every minute.</p>`;
  return page({ title: `${callStateLabels[p.state]} · ${p.game.title}`, body, refreshSeconds: 60 });
}
