// Posts a webhook the way the SMS provider does: form-encoded, with X-Twilio-Signature computed by the
// official SDK over the public URL and the parameters. Also reads the <Message> replies of a TwiML answer.
import twilio from 'twilio';

export interface WebhookAnswer {
  status: number;
  contentType: string;
  body: string;
}

export interface SignedPost {
  /** The public URL the app was configured with: it is what gets signed. */
  url: string;
  params: Record<string, string>;
  authToken: string;
  /**
   * Where to connect when the public URL is not reachable from here (in real life, a tunnel or a load
   * balancer in front of the app): only the origin changes, the path and the signed URL do not.
   */
  deliverTo?: string;
}

export async function postSignedWebhook(p: SignedPost): Promise<WebhookAnswer> {
  const target = new URL(p.url);
  if (p.deliverTo) {
    const via = new URL(p.deliverTo);
    target.protocol = via.protocol;
    target.host = via.host;
  }
  const res = await fetch(target, {
    method: 'POST',
    headers: {
      'Content-Type': 'application/x-www-form-urlencoded',
      'User-Agent': 'TwilioProxy/1.1',
      'X-Twilio-Signature': twilio.getExpectedTwilioSignature(p.authToken, p.url, p.params),
    },
    body: new URLSearchParams(p.params).toString(),
    redirect: 'manual',
    signal: AbortSignal.timeout(15_000),
  });
  return { status: res.status, contentType: res.headers.get('content-type') ?? '', body: await res.text() };
}

const XML_ENTITIES: Record<string, string> = { amp: '&', lt: '<', gt: '>', quot: '"', apos: "'" };

/**
 * The texts of the <Message> verbs in a TwiML answer. TwiML written by the SDK is flat and small, so a
 * pattern plus entity decoding is enough here; <Message><Body>…</Body></Message> is read too.
 */
export function twimlMessages(xml: string): string[] {
  const texts: string[] = [];
  for (const m of xml.matchAll(/<Message\b[^>]*>([\s\S]*?)<\/Message>/g)) {
    const inner = m[1] ?? '';
    const body = /<Body\b[^>]*>([\s\S]*?)<\/Body>/.exec(inner)?.[1] ?? inner.replace(/<[^>]+>/g, '');
    const text = body
      .replace(
        /&(amp|lt|gt|quot|apos);|&#(\d+);|&#x([0-9a-f]+);/gi,
        (_all, name: string | undefined, dec: string | undefined, hex: string | undefined) =>
          name ? XML_ENTITIES[name.toLowerCase()]! : String.fromCodePoint(dec ? Number(dec) : parseInt(hex!, 16)),
      )
      .trim();
    if (text) texts.push(text);
  }
  return texts;
}
