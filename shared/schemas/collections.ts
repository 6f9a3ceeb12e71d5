import { z } from 'zod';
import { ROLES } from '../domain/roles';
import { collectionName, email } from './auth';
import { timeZone, uuid } from './common';

export const collectionResponse = z.object({
  id: z.string(),
  name: z.string(),
  timeZone: z.string(),
  role: z.enum(ROLES),
});
export type CollectionResponse = z.infer<typeof collectionResponse>;

/** Another collection of one's own (a partner's, one to restore a backup into). */
export const newCollectionBody = z.object({ name: collectionName, timeZone });
export type NewCollectionBody = z.infer<typeof newCollectionBody>;

export const memberResponse = z.object({
  userId: z.string(),
  displayName: z.string(),
  email: z.string(),
  role: z.enum(ROLES),
  startsAt: z.string().nullable(),
  endsAt: z.string().nullable(),
});

/** The roles an owner invites by e-mail here; helpers come through a cover's invite. */
export const MEMBER_INVITE_ROLES = ['keeper', 'owner'] as const;
export type MemberInviteRole = (typeof MEMBER_INVITE_ROLES)[number];

export const pendingInvite = z.object({
  id: z.string(),
  email: z.string(),
  role: z.enum(MEMBER_INVITE_ROLES),
  sentAt: z.string(),
  expiresAt: z.string(),
  /** The link no longer works: the owner may send a new one or cancel the invite. */
  expired: z.boolean(),
});
export type PendingInvite = z.infer<typeof pendingInvite>;
export const membersResponse = z.object({
  members: z.array(memberResponse),
  invites: z.array(pendingInvite),
});
export type MembersResponse = z.infer<typeof membersResponse>;

/**
 * Owners invite a keeper or a partner as co-owner by e-mail here (they join by accepting);
 * helpers through a cover invite.
 */
export const addMemberBody = z.object({
  email,
  role: z.enum(MEMBER_INVITE_ROLES, { message: 'Choose keeper or co-owner.' }).default('keeper'),
});
export type AddMemberBody = z.input<typeof addMemberBody>;
export const inviteSentResponse = z.object({ message: z.string() });
export const memberParams = z.object({ collectionId: uuid, userId: uuid });
export const inviteParams = z.object({ collectionId: uuid, inviteId: uuid });

/** Deleting a collection is confirmed by typing its name, as the settings screen asks. */
export const deleteCollectionBody = z.object({
  confirmName: z
    .string({ message: 'Type the collection’s name to confirm.' })
    .trim()
    .min(1, { message: 'Type the collection’s name to confirm.' })
    .max(200, { message: 'That is not the collection’s name.' }),
});
export type DeleteCollectionBody = z.infer<typeof deleteCollectionBody>;

/** What restoring a backup brought into the collection. */
export const restoreResponse = z.object({ animals: z.number().int(), events: z.number().int() });
