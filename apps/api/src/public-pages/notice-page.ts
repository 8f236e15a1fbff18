// Friendly full-page messages for the public pages (an inactive tag, an unknown status link, too many
// reports, a failure on our side), never an error dump.
import { markup } from './html.ts';
import { page } from './layout.ts';

export function noticePage(p: { title: string; lines: string[] }): string {
  const body = markup`
<p class="kicker">Game tag</p>
<h1>${p.title}</h1>
${p.lines.map((l) => markup`<p>${l}</p>`)}`;
  return page({ title: p.title, body });
}

export const inactiveTag = () =>
  noticePage({
    title: 'This game tag is not active',
    lines: [
      'The tag may have been replaced, or the game has moved or gone.',
      'If the game is not working, please tell the staff here so they can pass it on.',
    ],
  });

export const unknownStatus = () =>
  noticePage({
    title: 'We cannot find this report',
    lines: [
      'Check that the link is complete, exactly as it was given to you.',
      'If the game is still not working, scan its game tag and report it again.',
    ],
  });

export const tooManyReports = (minutes: number) =>
  noticePage({
    title: 'Too many reports just now',
    lines: [
      'We have had several reports from here, or for this game, in the last few minutes, so we have paused new ones.',
      `Please try again in about ${minutes} minute${minutes === 1 ? '' : 's'}. If the game was already reported, it is on the list and there is no need to report it again.`,
    ],
  });

export const somethingWentWrong = () =>
  noticePage({
    title: 'Something went wrong on our side',
    lines: ['Your report was not sent. Please try again in a moment.'],
  });
