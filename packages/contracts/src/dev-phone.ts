// The demo's development phone (/dev/phone): texting the app as any number.
import { z } from 'zod';
import { requiredText } from './common.ts';
import { phoneNumber } from './phone.ts';

/** What the page's plain (urlencoded) form sends. */
export const devPhoneReplyInput = z.object({ from: phoneNumber, body: requiredText(1600) });
