// Sending SMS through the provider's official SDK: the real service, or the local fake when one runs
// (same SDK, same requests). Provider failures become an SmsError that says whether trying again can help.
import twilio from 'twilio';
import type RequestClient from 'twilio/lib/base/RequestClient';

export interface SmsSender {
  /** Sends one SMS; resolves with the provider's message id. Throws SmsError on failure. */
  send(to: string, body: string): Promise<{ providerId: string; providerStatus?: string }>;
  /**
   * Ids (newest first) of the provider's messages with this recipient and text created since `since`:
   * lets the outbox tell "sent, then the process died" from "never sent".
   */
  sentSince?(to: string, body: string, since: Date): Promise<string[]>;
}

/** The provider's error for a recipient who texted STOP: nothing may be sent until they text START. */
export const SMS_OPTED_OUT = 21610;

export class SmsError extends Error {
  constructor(
    message: string,
    /** The provider's error code (21610, 21211, …), or a network error code (ECONNREFUSED, …). */
    readonly code: number | string | undefined,
    /** Worth trying again later (provider outage, network trouble, rate limit), not a problem with this message. */
    readonly retryable: boolean,
  ) {
    super(message);
    this.name = 'SmsError';
  }

  get optedOut(): boolean {
    return this.code === SMS_OPTED_OUT;
  }
}

export interface SmsSenderOptions {
  accountSid: string;
  authToken: string;
  /** Our number, E.164. */
  from: string;
  /** Base URL of the local fake; unset = the real service. */
  fakeUrl?: string;
  /** Where the provider posts delivery status changes (our /webhooks/sms/status). */
  statusCallbackUrl?: string;
  /** Give up on one request after this long (the outbox retries later). */
  timeoutMs?: number;
}

/** The SDK has no base-URL option: this HTTP client sends its requests to another origin, path unchanged. */
class OriginRewritingClient extends twilio.RequestClient {
  constructor(
    private readonly origin: string,
    timeoutMs: number,
  ) {
    super({ timeout: timeoutMs });
  }

  override request<T>(opts: RequestClient.RequestOptions<T>) {
    const uri = new URL(opts.uri);
    const target = new URL(this.origin);
    uri.protocol = target.protocol;
    uri.host = target.host;
    return super.request({ ...opts, uri: uri.toString() });
  }
}

/** What the SDK throws: RestException (status, code) for an HTTP answer, an axios error (code) for none. */
export function toSmsError(err: unknown): SmsError {
  const e = err as { status?: number; code?: number | string; message?: string };
  const message = e.message ?? String(err);
  if (typeof e.status === 'number') {
    // 5xx: the provider's trouble. 429: too fast. 401/403: our credentials, being fixed: the message is fine.
    const retryable = e.status >= 500 || e.status === 429 || e.status === 401 || e.status === 403;
    return new SmsError(message, e.code ?? e.status, retryable);
  }
  return new SmsError(message, e.code, true); // no answer at all: network trouble or a timeout
}

export function createSmsSender(opts: SmsSenderOptions): SmsSender {
  const timeout = opts.timeoutMs ?? 15_000;
  const client = twilio(opts.accountSid, opts.authToken, {
    timeout,
    ...(opts.fakeUrl ? { httpClient: new OriginRewritingClient(opts.fakeUrl, timeout) } : {}),
  });

  return {
    async send(to, body) {
      try {
        const message = await client.messages.create({
          to,
          from: opts.from,
          body,
          ...(opts.statusCallbackUrl ? { statusCallback: opts.statusCallbackUrl } : {}),
        });
        return { providerId: message.sid, providerStatus: message.status };
      } catch (err) {
        throw toSmsError(err);
      }
    },

    async sentSince(to, body, since) {
      try {
        // Filter by recipient and sender only: a message still queued has no date_sent, so a DateSent filter
        // would miss exactly the one we are looking for. The newest page is plenty for one recipient.
        const recent = await client.messages.list({ to, from: opts.from, limit: 50 });
        // One minute of slack for clock differences between us and the provider.
        return recent.filter((m) => m.body === body && m.dateCreated.getTime() >= since.getTime() - 60_000).map((m) => m.sid);
      } catch (err) {
        throw toSmsError(err);
      }
    },
  };
}
