// The public game-tag report (no sign-in). Apart from the other call shapes because it alone needs phone
// parsing, which the web app's first screen should not have to download.
import { z } from 'zod';
import { problemKinds } from './calls.ts';
import { shortText } from './common.ts';
import { phoneNumber } from './phone.ts';

/** Public report from a game tag (no sign-in). */
export const publicReportInput = z.strictObject({
  problem: z.enum(problemKinds, { error: 'choose what is wrong' }),
  note: shortText(1000).default(''),
  phone: z.union([z.literal(''), phoneNumber]).default(''),
  smsConsent: z
    .union([z.boolean(), z.literal('on'), z.literal('yes')])
    .transform((v) => v === true || v === 'on' || v === 'yes')
    .default(false),
});
export type PublicReportInput = z.input<typeof publicReportInput>;
