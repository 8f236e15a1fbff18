// A local SMTP server that stands in for a real mail provider: it accepts every message on loopback
// and keeps it for the developer page /dev/outbox and for tests to read.
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';

export interface CapturedMail {
  id: number;
  at: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
}

export interface MailFake {
  port: number;
  messages(): CapturedMail[];
  /** The newest message sent to `address`, if any. */
  lastTo(address: string): CapturedMail | undefined;
  clear(): void;
  stop(): Promise<void>;
}

const KEEP = 500;

export async function startMailFake(port = 0): Promise<MailFake> {
  const captured: CapturedMail[] = [];
  let nextId = 1;
  const server = new SMTPServer({
    secure: false,
    disabledCommands: ['STARTTLS'],
    authOptional: true,
    banner: 'Bumperline mail fake',
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((mail) => {
          captured.push({
            id: nextId++,
            at: new Date().toISOString(),
            from: mail.from?.text ?? session.envelope.mailFrom?.toString() ?? '',
            to: session.envelope.rcptTo.map((r) => r.address.toLowerCase()),
            subject: mail.subject ?? '',
            text: mail.text ?? '',
            html: typeof mail.html === 'string' ? mail.html : null,
          });
          if (captured.length > KEEP) captured.splice(0, captured.length - KEEP);
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  const address = server.server.address();
  const boundPort = typeof address === 'object' && address ? address.port : port;
  return {
    port: boundPort,
    messages: () => [...captured].reverse(),
    lastTo: (addr) => [...captured].reverse().find((m) => m.to.includes(addr.toLowerCase())),
    clear: () => void captured.splice(0),
    stop: () => new Promise((resolve) => server.close(() => resolve())),
  };
}
