// The game tag's report form: a plain multipart form that works with JavaScript off, big touch targets,
// and each problem shown beside its field (with a summary on top) when the form comes back.
import { problemKinds, problemLabels } from '@bumperline/contracts/calls';
import { markup } from './html.ts';
import { page } from './layout.ts';

export type ReportField = 'problem' | 'note' | 'phone' | 'smsConsent' | 'photo' | 'form';
export type ReportErrors = Partial<Record<ReportField, string>>;

export interface ReportValues {
  problem?: string;
  note?: string;
  phone?: string;
  smsConsent?: boolean;
}

export interface ReportPageParams {
  game: { title: string; venueName: string | null };
  action: string;
  values?: ReportValues;
  errors?: ReportErrors;
  /** A photo was chosen but the form came back: browsers cannot refill a file field, so say so. */
  photoNotKept?: boolean;
  maxPhotoMb: number;
  noteMax: number;
}

/** Where the summary's link for a field jumps to. */
const anchor: Record<ReportField, string> = {
  problem: `problem-${problemKinds[0]}`,
  note: 'note',
  phone: 'phone',
  smsConsent: 'sms-consent',
  photo: 'photo',
  form: 'report-form',
};

function fieldError(id: string, message: string | undefined) {
  return message ? markup`<p class="error" id="${id}-error">${message}</p>` : '';
}

export function reportPage(p: ReportPageParams): string {
  const v = p.values ?? {};
  const e = p.errors ?? {};
  const listed = (Object.entries(e) as [ReportField, string][]).filter(([, m]) => m);
  const invalid = (f: ReportField) => (e[f] ? 'true' : 'false');
  const describedBy = (f: ReportField, hint: string) => [hint, e[f] ? `${anchor[f]}-error` : undefined].filter(Boolean).join(' ');
  const summary = listed.length
    ? markup`<div class="summary" role="alert" id="report-errors">
<p>Please check ${listed.length === 1 ? 'this' : 'these'}:</p>
<ul>${listed.map(([f, m]) => markup`<li><a href="#${anchor[f]}">${m}</a></li>`)}</ul>
</div>`
    : '';
  const choices = problemKinds.map(
    (k, i) =>
      markup`<label class="choice" for="problem-${k}"><input type="radio" name="problem" id="problem-${k}" value="${k}"${v.problem === k ? markup` checked` : ''}${i === 0 ? markup` required` : ''}> <span>${problemLabels[k]}</span></label>`,
  );

  const body = markup`
<p class="kicker">Report a problem</p>
<h1>${p.game.title}</h1>
<p class="where">${p.game.venueName ? `at ${p.game.venueName}` : ''}</p>
${summary}
<form id="report-form" method="post" action="${p.action}" enctype="multipart/form-data">
<fieldset${e.problem ? markup` aria-describedby="problem-error"` : ''}>
<legend>What is wrong with the game?</legend>
${fieldError('problem', e.problem)}
${choices}
</fieldset>

<div class="field">
<label class="label" for="note">Anything else we should know? <span class="opt">(optional)</span></label>
<p class="hint" id="note-hint">What happened, what the screen says, which button. Up to ${p.noteMax} characters.</p>
${fieldError('note', e.note)}
<textarea name="note" id="note" maxlength="${p.noteMax}" rows="4" aria-describedby="${describedBy('note', 'note-hint')}" aria-invalid="${invalid('note')}">${v.note ?? ''}</textarea>
</div>

<div class="field">
<label class="label" for="photo">Add a photo <span class="opt">(optional)</span></label>
<p class="hint" id="photo-hint">A JPEG, PNG or WebP picture, up to ${p.maxPhotoMb} MB.${p.photoNotKept ? ' The photo you chose was not kept; please add it again.' : ''}</p>
${fieldError('photo', e.photo)}
<input type="file" name="photo" id="photo" accept="image/jpeg,image/png,image/webp" data-max-bytes="${p.maxPhotoMb * 1024 * 1024}" aria-describedby="${describedBy('photo', 'photo-hint')}" aria-invalid="${invalid('photo')}">
</div>

<fieldset>
<legend>Text me updates <span class="opt">(optional)</span></legend>
<label class="label" for="phone">Mobile number</label>
<p class="hint" id="phone-hint">Only if you want a text when the game is being fixed. We use it for nothing else.</p>
${fieldError('phone', e.phone)}
<input type="tel" name="phone" id="phone" autocomplete="tel" inputmode="tel" maxlength="30" value="${v.phone ?? ''}" aria-describedby="${describedBy('phone', 'phone-hint')}" aria-invalid="${invalid('phone')}">
${fieldError('sms-consent', e.smsConsent)}
<label class="check" for="sms-consent"><input type="checkbox" name="smsConsent" id="sms-consent" value="yes"${v.smsConsent ? markup` checked` : ''}> <span>Yes, text me updates about this report. Reply STOP to any text to end them.</span></label>
</fieldset>

<button type="submit">Send report</button>
</form>`;

  return page({ title: `Report a problem · ${p.game.title}`, body, script: '/t-assets/report.js' });
}
