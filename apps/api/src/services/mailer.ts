// Outgoing e-mail through nodemailer: a real SMTP server when SMTP_URL is set, else the local fake.
import nodemailer from 'nodemailer';

export interface Mail {
  to: string;
  subject: string;
  text: string;
  html?: string;
}

export interface Mailer {
  send(mail: Mail): Promise<void>;
}

export function createMailer(opts: { smtpUrl?: string; fakePort?: number; from: string }): Mailer {
  const transport = opts.smtpUrl
    ? nodemailer.createTransport(opts.smtpUrl)
    : nodemailer.createTransport({ host: '127.0.0.1', port: opts.fakePort, secure: false, ignoreTLS: true });
  return {
    async send(mail) {
      await transport.sendMail({ from: opts.from, ...mail });
    },
  };
}
