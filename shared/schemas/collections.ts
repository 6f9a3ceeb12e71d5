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

export const pendingInvite = z.object({
  id: z.string(),
  email: z.string(),
  sentAt: z.string(),
  expiresAt: z.string(),
});
export const membersResponse = z.object({
  members: z.array(memberResponse),
  invites: z.array(pendingInvite),
});
export type MembersResponse = z.infer<typeof membersResponse>;

/** Owners invite keepers by e-mail here (they join by accepting); helpers through a cover invite. */
export const addMemberBody = z.object({ email, role: z.enum(['keeper']).default('keeper') });
export const inviteSentResponse = z.object({ message: z.string() });
export const memberParams = z.object({ collectionId: uuid, userId: uuid });

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
