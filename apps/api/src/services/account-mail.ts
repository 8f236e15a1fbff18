// The wording of the e-mails about a person's own account: confirming a sign-up, a sign-up with an
// address that already has an account, password-reset and sign-in links.
import type { Mail } from './mailer.ts';
import { appLink } from './links.ts';

export function confirmAddressMail(to: string, origin: string, token: string): Mail {
  const link = appLink(origin, `/verify-email?token=${token}`);
  return {
    to,
    subject: 'Confirm your e-mail address for Bumperline',
    text: `Someone signed up for Bumperline with ${to}. If it was you, confirm the address here with the password you chose (valid for 24 hours, once):\n${link}\n\nIf it was not you, ignore this message: nobody can sign in with that sign-up until the address is confirmed.`,
  };
}

/** Sent instead of a confirmation when the address already has an account: the form itself says nothing. */
export function signUpWithTakenAddressMail(to: string, origin: string): Mail {
  return {
    to,
    subject: 'Someone tried to sign up for Bumperline with your address',
    text: `Someone tried to sign up for Bumperline with ${to}, which already has an account. Nothing was changed.\n\nIf it was you, sign in here:\n${appLink(origin, '/sign-in')}\n\nor, if you forgot your password, reset your password here:\n${appLink(origin, '/forgot-password')}\n\nIf it was not you, you can ignore this message.`,
  };
}

export function passwordResetMail(to: string, origin: string, token: string): Mail {
  const link = appLink(origin, `/reset-password?token=${token}`);
  return {
    to,
    subject: 'Reset your Bumperline password',
    text: `Someone asked to reset the password for ${to}.\n\nChoose a new password here (valid for one hour):\n${link}\n\nIf it was not you, ignore this message.`,
  };
}

export function signInLinkMail(to: string, origin: string, token: string): Mail {
  const link = appLink(origin, `/sign-in/link?token=${token}`);
  return {
    to,
    subject: 'Your Bumperline sign-in link',
    text: `Open this link to sign in to Bumperline (valid for 20 minutes, once):\n${link}\n\nIf you did not ask for it, ignore this message.`,
  };
}
