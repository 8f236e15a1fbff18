// The wording of the messages a service call sends. Short: an SMS segment is 160 GSM-7 characters.
import { callRef, callStateLabels, problemLabels, type CallState, type ProblemKind } from '@bumperline/contracts/calls';

interface CallFacts {
  id: string;
  gameTitle: string;
  venueName: string | null;
  problem: ProblemKind;
}

const where = (c: CallFacts) => (c.venueName ? ` at ${c.venueName}` : '');

export function technicianAssignedSms(c: CallFacts, link: string): string {
  return `Bumperline call ${callRef(c.id)}: ${c.gameTitle}${where(c)} — ${problemLabels[c.problem]}. Reply YES to accept or NO to decline. ${link}`;
}

export function reporterUpdateSms(c: CallFacts, state: CallState, link: string): string {
  const line: Partial<Record<CallState, string>> = {
    assigned: 'a technician has been assigned',
    on_the_way: 'a technician is on the way',
    on_site: 'the technician is on site',
    waiting_parts: 'it is waiting on parts',
    at_shop: 'it was taken to the shop for repair',
    fixed: 'it is fixed',
    closed: 'the call is closed',
    cancelled: 'the call was cancelled',
  };
  return `${c.gameTitle}${where(c)}: ${line[state] ?? callStateLabels[state].toLowerCase()}. Status: ${link} Reply STOP to opt out.`;
}

export function dispatcherWarningSms(c: CallFacts & { targetAt: Date }, minutesLeft: number, link: string): string {
  const when = minutesLeft <= 0 ? 'is past its response target' : `misses its response target in ${minutesLeft} min`;
  return `Bumperline: call ${callRef(c.id)} (${c.gameTitle}${where(c)}) ${when}. ${link}`;
}

export function venueCallOpenedEmail(c: CallFacts, link: string) {
  return {
    subject: `Service call opened: ${c.gameTitle}${where(c)}`,
    body: `A problem was reported with ${c.gameTitle}${where(c)}: ${problemLabels[c.problem]}.\n\nWe have opened service call ${callRef(c.id)} and will keep you posted. Follow it here:\n${link}`,
  };
}

export function venueCallClosedEmail(c: CallFacts, link: string) {
  return {
    subject: `Service call closed: ${c.gameTitle}${where(c)}`,
    body: `Service call ${callRef(c.id)} for ${c.gameTitle}${where(c)} is closed.\n\nDetails:\n${link}`,
  };
}
