import { z } from 'zod';
import { ROLES } from '../domain/roles';
import { TEMPERATURE_UNITS } from '../domain/temperature';
import { utf8ByteLength } from '../domain/text-bytes';
import { timeZone } from './common';

/** bcrypt reads at most 72 bytes (OWASP Password Storage Cheat Sheet, "bcrypt"). */
export const PASSWORD_MAX_BYTES = 72;
// OWASP ASVS 4.0.3 2.1.1: at least 12 characters.
export const PASSWORD_MIN_CHARS = 12;

export const email = z
  .string()
  .trim()
  .toLowerCase()
  .max(254, { message: 'That e-mail address is too long.' })
  .pipe(z.email({ message: 'Enter an e-mail address such as name@example.com.' }));

export const newPassword = z
  .string()
  .min(PASSWORD_MIN_CHARS, { message: `Use at least ${PASSWORD_MIN_CHARS} characters.` })
  .refine((p) => utf8ByteLength(p) <= PASSWORD_MAX_BYTES, {
    message: `Passwords can be at most ${PASSWORD_MAX_BYTES} bytes long. Letters such as é and emoji take more than one byte each.`,
  });

/** Signing in never reveals the rules a password was made under; just bound the size. */
const existingPassword = z
  .string()
  .min(1, { message: 'Enter your password.' })
  .max(1024, { message: 'That password is too long.' });

/**
 * Sign-up starts with the e-mail alone: the answer is the same whether or not it has an
 * account, and the rest is chosen from the link the e-mail carries.
 */
export const signUpBody = z.object({ email });
export type SignUpBody = z.infer<typeof signUpBody>;

export const signUpToken = z
  .string()
  .min(20, { message: 'This sign-up link is not valid.' })
  .max(200, { message: 'This sign-up link is not valid.' });

/** A collection's name, at sign-up and when someone starts another collection. */
export const collectionName = z
  .string({ message: 'Name your collection.' })
  .trim()
  .min(1, { message: 'Name your collection.' })
  .max(80, { message: 'Keep the collection name under 80 characters.' });

/** What the sign-up link's page asks for. */
export const accountDetails = z.object({
  password: newPassword,
  displayName: z.string().trim().min(1, { message: 'Tell us what to call you.' }).max(80),
  collectionName,
  timeZone,
});
export const signUpFinishBody = accountDetails.extend({ token: signUpToken });
export type SignUpFinishBody = z.infer<typeof signUpFinishBody>;

/**
 * A server with no account yet: its first visitor makes the first owner's account on the spot,
 * with no e-mail round trip (there may be no mail server yet, and nobody else to wait for).
 */
export const firstRunResponse = z.object({ firstOwner: z.boolean() });
export type FirstRunResponse = z.infer<typeof firstRunResponse>;
export const firstOwnerBody = accountDetails.extend({ email });
export type FirstOwnerBody = z.infer<typeof firstOwnerBody>;

export const signUpStartedResponse = z.object({ message: z.string() });
export const signUpPreviewResponse = z.object({ email: z.string() });
/** The same words for every address (decision 012). */
export const resetRequestedResponse = z.object({ message: z.string() });

export const signInBody = z.object({ email, password: existingPassword });
export type SignInBody = z.infer<typeof signInBody>;

export const resetRequestBody = z.object({ email });
export const resetBody = z.object({
  token: z.string().min(20, { message: 'This reset link is not valid.' }).max(200),
  password: newPassword,
});
export const changePasswordBody = z.object({
  currentPassword: existingPassword,
  newPassword,
});

export const membershipSummary = z.object({
  collectionId: z.string(),
  collectionName: z.string(),
  timeZone: z.string(),
  /** Printed in every label's QR: which collection a code belongs to. */
  labelTag: z.string(),
  role: z.enum(ROLES),
  startsAt: z.string().nullable(),
  endsAt: z.string().nullable(),
});
export type MembershipSummary = z.infer<typeof membershipSummary>;

export const meResponse = z.object({
  user: z.object({
    id: z.string(),
    email: z.string(),
    displayName: z.string(),
    /** °C or °F, the person's own setting (stored on the server; every device follows it). */
    temperatureUnit: z.enum(TEMPERATURE_UNITS).default('C'),
  }),
  memberships: z.array(membershipSummary),
});
export type MeResponse = z.infer<typeof meResponse>;

export const demoInfoResponse = z.object({
  demo: z.boolean(),
  accounts: z.array(z.object({ email: z.string(), role: z.string() })),
  password: z.string().optional(),
});
export type DemoInfoResponse = z.infer<typeof demoInfoResponse>;
