import { z } from 'zod';
import { ROLES } from '../domain/roles';
import { email } from './auth';
import { uuid } from './common';

export const collectionResponse = z.object({
  id: z.string(),
  name: z.string(),
  timeZone: z.string(),
  role: z.enum(ROLES),
});
export type CollectionResponse = z.infer<typeof collectionResponse>;

export const memberResponse = z.object({
  userId: z.string(),
  displayName: z.string(),
  email: z.string(),
  role: z.enum(ROLES),
  startsAt: z.string().nullable(),
  endsAt: z.string().nullable(),
});
export const memberListResponse = z.object({ members: z.array(memberResponse) });
export type MemberListResponse = z.infer<typeof memberListResponse>;

/** Owners add existing accounts as keepers here; helpers arrive through a cover invite. */
export const addMemberBody = z.object({ email, role: z.enum(['keeper']) });
export const memberParams = z.object({ collectionId: uuid, userId: uuid });

/** Deleting a collection is confirmed by typing its name, as the settings screen asks. */
export const deleteCollectionBody = z.object({
  confirmName: z.string({ message: 'Type the collection’s name to confirm.' }).trim().min(1, { message: 'Type the collection’s name to confirm.' }).max(200, { message: 'That is not the collection’s name.' }),
});
export type DeleteCollectionBody = z.infer<typeof deleteCollectionBody>;
