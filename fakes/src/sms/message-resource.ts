// The Message resource as the provider's REST API (version 2010-04-01) writes it, and its error bodies,
// so the official SDK parses the fake's answers exactly as it parses the real ones.
import { randomBytes } from 'node:crypto';

export const API_VERSION = '2010-04-01';

export type MessageStatus = 'queued' | 'sent' | 'delivered' | 'undelivered' | 'failed' | 'received';
export type MessageDirection = 'outbound-api' | 'outbound-reply' | 'inbound';

export interface FakeMessage {
  sid: string;
  direction: MessageDirection;
  from: string;
  to: string;
  body: string;
  status: MessageStatus;
  errorCode: number | null;
  errorMessage: string | null;
  numSegments: number;
  dateCreated: Date;
  dateUpdated: Date;
  /** Set when the message left for the carrier (outbound) or arrived (inbound). */
  dateSent: Date | null;
  /** Where status changes are posted, as given with the send. */
  statusCallback: string | null;
}

/** "SM" and 32 hex digits: 34 characters, like the provider's message ids. */
export function newMessageSid(): string {
  return `SM${randomBytes(16).toString('hex')}`;
}

/** RFC 2822 in UTC, as the API writes dates: "Thu, 24 Aug 2023 05:01:45 +0000". */
export function rfc2822(d: Date): string {
  return d.toUTCString().replace('GMT', '+0000');
}

// GSM 03.38: the basic set costs one septet per character, the extension table two; anything else
// forces UCS-2. Segments of a long message carry a 7-septet (GSM) or 3-character (UCS-2) header.
const GSM_BASIC =
  '@£$¥èéùìòÇ\nØø\rÅåΔ_ΦΓΛΩΠΨΣΘΞÆæßÉ !"#¤%&\'()*+,-./0123456789:;<=>?¡ABCDEFGHIJKLMNOPQRSTUVWXYZÄÖÑÜ§¿abcdefghijklmnopqrstuvwxyzäöñüà';
const GSM_EXTENDED = '^{}\\[~]|€\f';

export function segmentCount(body: string): number {
  const chars = [...body];
  if (chars.every((c) => GSM_BASIC.includes(c) || GSM_EXTENDED.includes(c))) {
    const septets = chars.reduce((n, c) => n + (GSM_EXTENDED.includes(c) ? 2 : 1), 0);
    return septets <= 160 ? 1 : Math.ceil(septets / 153);
  }
  const units = body.length; // UTF-16 code units, as UCS-2 counts them
  return units <= 70 ? 1 : Math.ceil(units / 67);
}

export function messageUri(accountSid: string, sid: string): string {
  return `/${API_VERSION}/Accounts/${accountSid}/Messages/${sid}.json`;
}

export function messageJson(m: FakeMessage, accountSid: string) {
  return {
    account_sid: accountSid,
    api_version: API_VERSION,
    body: m.body,
    date_created: rfc2822(m.dateCreated),
    date_sent: m.dateSent ? rfc2822(m.dateSent) : null,
    date_updated: rfc2822(m.dateUpdated),
    direction: m.direction,
    error_code: m.errorCode,
    error_message: m.errorMessage,
    from: m.from,
    messaging_service_sid: null,
    num_media: '0',
    num_segments: String(m.numSegments),
    price: null,
    price_unit: 'USD',
    sid: m.sid,
    status: m.status,
    subresource_uris: { media: `/${API_VERSION}/Accounts/${accountSid}/Messages/${m.sid}/Media.json` },
    to: m.to,
    uri: messageUri(accountSid, m.sid),
  };
}

/** The API's error body: its numeric code, a message, where to read more, and the HTTP status. */
export function errorJson(status: number, code: number, message: string) {
  return { code, message, more_info: `https://www.twilio.com/docs/errors/${code}`, status };
}
