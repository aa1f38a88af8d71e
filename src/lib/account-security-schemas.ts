import { z } from 'zod';

/** Second-factor and session forms, shared by the account page and the endpoints. */
export const codeSchema = z.object({
  code: z
    .string({ error: 'Enter the 6-digit code from the app.' })
    .trim()
    .min(6, 'Enter the 6-digit code from the app.')
    .max(20),
});
export const disableSecondFactorSchema = z.object({
  password: z.string({ error: 'Enter your password.' }).min(1, 'Enter your password.').max(200),
  code: z
    .string({ error: 'Enter a code from the app or a recovery code.' })
    .trim()
    .min(6, 'Enter a code from the app or a recovery code.')
    // A recovery code is 20 hex digits, written with dashes (23 characters), perhaps with spaces.
    .max(40),
});
/** A password and a code, re-entered to make new recovery codes (the same proof as turning the factor off). */
export const passwordAndCodeSchema = disableSecondFactorSchema;
export const requireSecondFactorSchema = z.object({ required: z.boolean({ error: 'required: true or false.' }) });
