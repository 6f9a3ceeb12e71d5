import { randomUUID } from 'node:crypto';
import fs from 'node:fs/promises';
import path from 'node:path';
import { and, eq } from 'drizzle-orm';
import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import { animals, eventPhotos, events } from '../../db/schema/animals';
import { HttpError } from '../../middleware/errors';
import { imageTypeOf, isPlainFileName } from './image-type';

// sharp and libvips (~28 MB resident) load with the first photo, not with the server.
const loadSharp = async () => (await import('sharp')).default;

export const MAX_PHOTO_BYTES = 10 * 1024 * 1024;
export const PHOTO_SIZES = { full: 1600, thumb: 320 } as const;
export type PhotoSize = keyof typeof PHOTO_SIZES;

const notFound = () => new HttpError(404, 'not_found', 'We could not find that animal.');

/**
 * Photos live in the storage folder under the collection's id, named by a random key. Uploads
 * are re-encoded as WebP at two sizes, which also drops the camera's metadata (GPS included).
 */
export function createPhotosService(db: NodePgDatabase, storageDir: string, now: () => Date) {
  const folder = (collectionId: string) => path.join(storageDir, 'photos', collectionId);
  const fileOf = (collectionId: string, key: string, size: PhotoSize) => path.join(folder(collectionId), `${key}-${size}.webp`);

  async function keyOf(collectionId: string, animalId: string) {
    const [row] = await db.select({ key: animals.photoKey }).from(animals).where(and(eq(animals.collectionId, collectionId), eq(animals.id, animalId)));
    if (!row) throw notFound();
    return row.key;
  }

  async function removeFiles(collectionId: string, key: string | null) {
    if (!key) return;
    await Promise.all(Object.keys(PHOTO_SIZES).map((s) => fs.rm(fileOf(collectionId, key, s as PhotoSize), { force: true })));
  }

  /** Checks an upload and writes it at both sizes under a new key; nothing is written if it fails. */
  async function store(collectionId: string, file: { buffer: Buffer; originalname: string } | undefined): Promise<string> {
    if (!file || file.buffer.length === 0) throw new HttpError(400, 'empty', 'Choose a photo to upload; the file was empty.');
    if (!isPlainFileName(file.originalname)) throw new HttpError(400, 'bad_name', 'That file name is not allowed. Rename the photo and try again.');
    if (!imageTypeOf(file.buffer)) throw new HttpError(415, 'not_an_image', 'Photos must be JPEG, PNG or WebP images.');
    const key = randomUUID();
    let images: Buffer[];
    try {
      images = await Promise.all(
        Object.values(PHOTO_SIZES).map(async (px) => (await loadSharp())(file.buffer, { failOn: 'error' }).rotate().resize(px, px, { fit: 'inside', withoutEnlargement: true }).webp({ quality: 80 }).toBuffer()),
      );
    } catch {
      throw new HttpError(415, 'not_an_image', 'That image could not be read. It may be damaged; try another photo.');
    }
    await fs.mkdir(folder(collectionId), { recursive: true });
    await Promise.all(Object.keys(PHOTO_SIZES).map((s, i) => fs.writeFile(fileOf(collectionId, key, s as PhotoSize), images[i]!)));
    return key;
  }

  async function moltOf(collectionId: string, animalId: string, eventId: string) {
    const [row] = await db
      .select({ id: events.id, key: eventPhotos.photoKey })
      .from(events)
      .leftJoin(eventPhotos, eq(eventPhotos.eventId, events.id))
      .where(and(eq(events.id, eventId), eq(events.animalId, animalId), eq(events.collectionId, collectionId), eq(events.kind, 'molted')));
    if (!row) throw new HttpError(404, 'not_found', 'We could not find that molt. If you recorded it offline, let it sync first.');
    return row;
  }

  /** A backup's photo: the full image kept byte for byte, the thumbnail made again. */
  async function restoreFiles(collectionId: string, webp: Buffer) {
    const key = randomUUID();
    let thumb: Buffer;
    try {
      thumb = await (await loadSharp())(webp, { failOn: 'error' }).resize(PHOTO_SIZES.thumb, PHOTO_SIZES.thumb, { fit: 'inside', withoutEnlargement: true }).webp({ quality: 80 }).toBuffer();
    } catch {
      throw new HttpError(422, 'invalid', 'A photo in this backup could not be read.');
    }
    await fs.mkdir(folder(collectionId), { recursive: true });
    await fs.writeFile(fileOf(collectionId, key, 'full'), webp);
    await fs.writeFile(fileOf(collectionId, key, 'thumb'), thumb);
    return key;
  }

  return {
    async save(collectionId: string, animalId: string, file: { buffer: Buffer; originalname: string } | undefined) {
      const previous = await keyOf(collectionId, animalId);
      const key = await store(collectionId, file);
      const at = now();
      await db.update(animals).set({ photoKey: key, photoUpdatedAt: at }).where(eq(animals.id, animalId));
      await removeFiles(collectionId, previous);
      return { photoVersion: at.toISOString() };
    },

    /** A photo of a molt (the exuviae), shown in the animal's timeline. */
    async saveMolt(collectionId: string, animalId: string, eventId: string, file: { buffer: Buffer; originalname: string } | undefined) {
      const molt = await moltOf(collectionId, animalId, eventId);
      const key = await store(collectionId, file);
      await db.insert(eventPhotos).values({ eventId, collectionId, photoKey: key }).onConflictDoUpdate({ target: eventPhotos.eventId, set: { photoKey: key, createdAt: now() } });
      await removeFiles(collectionId, molt.key);
    },

    async moltFile(collectionId: string, animalId: string, eventId: string, size: PhotoSize): Promise<string> {
      const molt = await moltOf(collectionId, animalId, eventId);
      if (!molt.key) throw new HttpError(404, 'no_photo', 'This molt has no photo.');
      return fileOf(collectionId, molt.key, size);
    },

    /** A photo from a backup: the full image kept byte for byte, the thumbnail made again. */
    async restore(collectionId: string, animalId: string, webp: Buffer) {
      const key = await restoreFiles(collectionId, webp);
      await db.update(animals).set({ photoKey: key, photoUpdatedAt: now() }).where(eq(animals.id, animalId));
    },

    async restoreMolt(collectionId: string, eventId: string, webp: Buffer) {
      const key = await restoreFiles(collectionId, webp);
      await db.insert(eventPhotos).values({ eventId, collectionId, photoKey: key });
    },


    /** The stored file's path, or a 404 when the animal has no photo. */
    async file(collectionId: string, animalId: string, size: PhotoSize): Promise<string> {
      const key = await keyOf(collectionId, animalId);
      if (!key) throw new HttpError(404, 'no_photo', 'This animal has no photo yet.');
      return fileOf(collectionId, key, size);
    },

    async remove(collectionId: string, animalId: string) {
      const key = await keyOf(collectionId, animalId);
      await db.update(animals).set({ photoKey: null, photoUpdatedAt: null }).where(eq(animals.id, animalId));
      await removeFiles(collectionId, key);
    },
  };
}
export type PhotosService = ReturnType<typeof createPhotosService>;
