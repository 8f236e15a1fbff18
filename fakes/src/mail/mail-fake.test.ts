import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import nodemailer from 'nodemailer';
import { startMailFake, type MailFake } from './mail-fake.ts';

let fake: MailFake;
beforeAll(async () => {
  fake = await startMailFake();
});
afterAll(() => fake.stop());

describe('mail fake', () => {
  it('keeps what a real SMTP client (nodemailer) sends, newest first', async () => {
    const transport = nodemailer.createTransport({ host: '127.0.0.1', port: fake.port, secure: false, ignoreTLS: true });
    await transport.sendMail({ from: 'a@x.test', to: 'Bob <BOB@x.test>', subject: 'One', text: 'first' });
    await transport.sendMail({ from: 'a@x.test', to: 'bob@x.test', subject: 'Two', text: 'second', html: '<p>second</p>' });
    expect(fake.messages().map((m) => m.subject)).toEqual(['Two', 'One']);
    expect(fake.lastTo('bob@x.test')).toMatchObject({ subject: 'Two', text: 'second', html: '<p>second</p>' });
    fake.clear();
    expect(fake.messages()).toEqual([]);
  });
});
