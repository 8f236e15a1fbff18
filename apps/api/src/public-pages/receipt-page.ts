// The receipt after a report: what happens next and the status link to keep.
import { markup } from './html.ts';
import { page } from './layout.ts';

/** What became of the phone number the reporter gave, so the receipt never promises texts that will not come. */
export type SmsOutcome = 'on' | 'taken' | 'not-kept' | 'none';

export interface ReceiptPageParams {
  game: { title: string; venueName: string | null };
  ref: string;
  statusPath: string;
  statusUrl: string;
  joined: boolean;
  sms: SmsOutcome;
}

const smsLine: Record<SmsOutcome, string> = {
  on: 'We will text you when a technician is on the way and when the game is fixed. Reply STOP to end the texts.',
  taken: 'Someone who reported this before you is already getting the text updates; follow the progress on the status page.',
  'not-kept': 'You gave a phone number but did not tick the box for text updates, so we did not keep the number.',
  none: '',
};

export function receiptPage(p: ReceiptPageParams): string {
  const what = p.joined
    ? 'This game had already been reported, so it is on the list to be fixed. We added what you told us to that report.'
    : 'The operator has been told and will send a technician.';
  const body = markup`
<p class="kicker">Report received</p>
<h1>Thank you. We have your report.</h1>
<p class="where">${p.game.title}${p.game.venueName ? ` at ${p.game.venueName}` : ''}</p>
<div class="card">
<p>${what}</p>
<p>Reference: <strong>${p.ref}</strong></p>
</div>
${smsLine[p.sms] ? markup`<p>${smsLine[p.sms]}</p>` : ''}
<h2>Follow the repair</h2>
<p>Keep this link to see where the repair stands:</p>
<p class="big"><a href="${p.statusPath}">See the status of this report</a></p>
<p class="hint link">${p.statusUrl}</p>`;
  return page({ title: `Report received · ${p.game.title}`, body });
}
