import { createHash, randomBytes } from 'node:crypto';

/** An invite link works for a week at most (a cover's also never after the cover has ended). */
export const INVITE_LIFETIME_MS = 7 * 24 * 60 * 60 * 1000;

/** Only the SHA-256 of a link's token is stored: a leaked table cannot be replayed as links. */
export const hashInviteToken = (token: string) => createHash('sha256').update(token).digest('hex');

/** 32 random bytes, base64url (256 bits), and the hash to store. */
export function newInviteToken() {
  const token = randomBytes(32).toString('base64url');
  return { token, tokenHash: hashInviteToken(token) };
}
