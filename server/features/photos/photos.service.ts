import { randomUUID } from 'node:crypto';
import fs from 'node:fs/promises';
import path from 'node:path';
import { EVENT_KINDS } from '#shared/domain/event-kinds';
import { SERVER_EVENT_KINDS } from '#shared/schemas/events';
import type { Db } from '../../db/client';
import { HttpError } from '../../middleware/errors';
import { imageTypeOf, isPlainFileName } from './image-type';
import {
  animalPhotoKey,
  findEventWithPhoto,
  findMolt,
  setAnimalPhoto,
  setEventPhoto,
} from './photos.repository';

// sharp and libvips (~28 MB resident) load with the first photo, not with the server.
const loadSharp = async () => {
  const sharp = (await import('sharp')).default;
  // Each photo is decoded once: libvips' operation cache (up to 50 MB by default) would only
  // hold memory, which a restore of many photos turns into resident size (decision 014).
  sharp.cache(false);
  return sharp;
};

/**
 * The facts a photo may go with: what a person records at the rack (an outcome, a note, a
 * molt). Server-written facts (moves, breeding records) and undos have none.
 */
export const PHOTO_EVENT_KINDS = EVENT_KINDS.filter(
  (k) => k !== 'void' && !SERVER_EVENT_KINDS.includes(k),
);

export const MAX_PHOTO_BYTES = 10 * 1024 * 1024;
export const PHOTO_SIZES = { full: 1600, thumb: 320 } as const;
export type PhotoSize = keyof typeof PHOTO_SIZES;

const notFound = () => new HttpError(404, 'not_found', 'We could not find that animal.');

export interface RestoreWorkspace {
  /** Where the uploaded backup is spooled. */
  readonly uploadFile: string;
  /** Checks a backup's photo and writes it aside (full image as given, thumbnail made again); returns its new key. */
  stagePhoto(webp: Buffer): Promise<string>;
  /** After the restore's commit: the staged photos move into the collection's folder. */
  commit(collectionId: string): Promise<void>;
  /** Removes the workspace and whatever is still in it. */
  discard(): Promise<void>;
}

/** A workspace left by a process that died mid-restore is removed a day later. */
const STALE_WORKSPACE_MS = 24 * 60 * 60 * 1000;

async function sweepOldWorkspaces(parent: string) {
  const entries = await fs.readdir(parent).catch(() => [] as string[]);
  for (const name of entries) {
    const full = path.join(parent, name);
    const stat = await fs.stat(full).catch(() => null);
    if (stat && Date.now() - stat.mtimeMs > STALE_WORKSPACE_MS)
      await fs.rm(full, { recursive: true, force: true });
  }
}

/**
 * A backup's photo is the full image as this server stored it: WebP, at most 1600 px a side.
 * Anything else is refused before libvips decodes it (a huge canvas would cost memory).
 */
async function restoredThumbnail(webp: Buffer): Promise<Buffer> {
  if (imageTypeOf(webp) !== 'webp')
    throw new HttpError(422, 'invalid', 'This photo is not a WebP image.');
  try {
    const image = (await loadSharp())(webp, {
      failOn: 'error',
      limitInputPixels: PHOTO_SIZES.full * PHOTO_SIZES.full,
    });
    const { width = 0, height = 0 } = await image.metadata();
    if (!width || !height || Math.max(width, height) > PHOTO_SIZES.full)
      throw new Error('too large');
    return await image
      .resize(PHOTO_SIZES.thumb, PHOTO_SIZES.thumb, { fit: 'inside', withoutEnlargement: true })
      .webp({ quality: 80 })
      .toBuffer();
  } catch {
    throw new HttpError(
      422,
      'invalid',
      `This photo could not be read, or is larger than the ${PHOTO_SIZES.full} px a side Rackside keeps.`,
    );
  }
}

/**
 * Photos live in the storage folder under the collection's id, named by a random key. Uploads
 * are re-encoded as WebP at two sizes, which also drops the camera's metadata (GPS included).
 */
export function createPhotosService(db: Db, storageDir: string, now: () => Date) {
  const folder = (collectionId: string) => path.join(storageDir, 'photos', collectionId);
  const fileOf = (collectionId: string, key: string, size: PhotoSize) =>
    path.join(folder(collectionId), `${key}-${size}.webp`);

  async function keyOf(collectionId: string, animalId: string) {
    const key = await animalPhotoKey(db, collectionId, animalId);
    if (key === undefined) throw notFound();
    return key;
  }

  async function removeFiles(collectionId: string, key: string | null) {
    if (!key) return;
    await Promise.all(
      Object.keys(PHOTO_SIZES).map((s) =>
        fs.rm(fileOf(collectionId, key, s as PhotoSize), { force: true }),
      ),
    );
  }

  /** Checks an upload and writes it at both sizes under a new key; nothing is written if it fails. */
  async function store(
    collectionId: string,
    file: { buffer: Buffer; originalname: string } | undefined,
  ): Promise<string> {
    if (!file || file.buffer.length === 0)
      throw new HttpError(400, 'empty', 'Choose a photo to upload; the file was empty.');
    if (!isPlainFileName(file.originalname))
      throw new HttpError(
        400,
        'bad_name',
        'That file name is not allowed. Rename the photo and try again.',
      );
    if (!imageTypeOf(file.buffer))
      throw new HttpError(415, 'not_an_image', 'Photos must be JPEG, PNG or WebP images.');
    const key = randomUUID();
    let images: Buffer[];
    try {
      images = await Promise.all(
        Object.values(PHOTO_SIZES).map(async (px) =>
          (await loadSharp())(file.buffer, { failOn: 'error' })
            .rotate()
            .resize(px, px, { fit: 'inside', withoutEnlargement: true })
            .webp({ quality: 80 })
            .toBuffer(),
        ),
      );
    } catch {
      throw new HttpError(
        415,
        'not_an_image',
        'That image could not be read. It may be damaged; try another photo.',
      );
    }
    await fs.mkdir(folder(collectionId), { recursive: true });
    await Promise.all(
      Object.keys(PHOTO_SIZES).map((s, i) =>
        fs.writeFile(fileOf(collectionId, key, s as PhotoSize), images[i]!),
      ),
    );
    return key;
  }

  async function moltOf(collectionId: string, animalId: string, eventId: string) {
    const row = await findMolt(db, collectionId, animalId, eventId);
    if (!row)
      throw new HttpError(
        404,
        'not_found',
        'We could not find that molt. If you recorded it offline, let it sync first.',
      );
    return row;
  }

  async function eventOf(collectionId: string, animalId: string, eventId: string) {
    const row = await findEventWithPhoto(db, collectionId, animalId, eventId, PHOTO_EVENT_KINDS);
    if (!row)
      throw new HttpError(
        404,
        'not_found',
        'We could not find that record. If it was made offline, let it sync first.',
      );
    return row;
  }

  return {
    async save(
      collectionId: string,
      animalId: string,
      file: { buffer: Buffer; originalname: string } | undefined,
    ) {
      const previous = await keyOf(collectionId, animalId);
      const key = await store(collectionId, file);
      const at = now();
      await setAnimalPhoto(db, animalId, key, at);
      await removeFiles(collectionId, previous);
      return { photoVersion: at.toISOString() };
    },

    /** A photo of a molt (the exuviae), shown in the animal's timeline. */
    async saveMolt(
      collectionId: string,
      animalId: string,
      eventId: string,
      file: { buffer: Buffer; originalname: string } | undefined,
    ) {
      const molt = await moltOf(collectionId, animalId, eventId);
      const key = await store(collectionId, file);
      await setEventPhoto(db, collectionId, eventId, key, now());
      await removeFiles(collectionId, molt.key);
    },

    async moltFile(
      collectionId: string,
      animalId: string,
      eventId: string,
      size: PhotoSize,
    ): Promise<string> {
      const molt = await moltOf(collectionId, animalId, eventId);
      if (!molt.key) throw new HttpError(404, 'no_photo', 'This molt has no photo.');
      return fileOf(collectionId, molt.key, size);
    },

    /** A photo going with a recorded outcome or note (what the keeper saw), shown in the timeline. */
    async saveEventPhoto(
      collectionId: string,
      animalId: string,
      eventId: string,
      file: { buffer: Buffer; originalname: string } | undefined,
    ) {
      const event = await eventOf(collectionId, animalId, eventId);
      const key = await store(collectionId, file);
      await setEventPhoto(db, collectionId, eventId, key, now());
      await removeFiles(collectionId, event.key);
    },

    async eventFile(
      collectionId: string,
      animalId: string,
      eventId: string,
      size: PhotoSize,
    ): Promise<string> {
      const event = await eventOf(collectionId, animalId, eventId);
      if (!event.key) throw new HttpError(404, 'no_photo', 'This record has no photo.');
      return fileOf(collectionId, event.key, size);
    },

    /** A stored photo's full image for a backup, or null when its file is missing. */
    async readFull(collectionId: string, key: string): Promise<Buffer | null> {
      return fs.readFile(fileOf(collectionId, key, 'full')).catch(() => null);
    },

    /**
     * A folder of its own for one restore, beside the photos (same disk, so staged photos move
     * into place with a rename): the upload is spooled there and the backup's photos written
     * there until the restore's transaction has committed.
     */
    async openRestoreWorkspace(): Promise<RestoreWorkspace> {
      const parent = path.join(storageDir, 'restoring');
      await sweepOldWorkspaces(parent);
      const dir = path.join(parent, randomUUID());
      await fs.mkdir(dir, { recursive: true });
      const staged: string[] = [];
      const stagedFile = (key: string, size: PhotoSize) => path.join(dir, `${key}-${size}.webp`);
      return {
        uploadFile: path.join(dir, 'upload.json'),
        async stagePhoto(webp: Buffer) {
          const thumb = await restoredThumbnail(webp);
          const key = randomUUID();
          staged.push(key);
          await fs.writeFile(stagedFile(key, 'full'), webp);
          await fs.writeFile(stagedFile(key, 'thumb'), thumb);
          return key;
        },
        async commit(collectionId: string) {
          await fs.mkdir(folder(collectionId), { recursive: true });
          for (const key of staged) {
            for (const size of Object.keys(PHOTO_SIZES) as PhotoSize[])
              await fs.rename(stagedFile(key, size), fileOf(collectionId, key, size));
          }
          staged.length = 0;
        },
        async discard() {
          await fs.rm(dir, { recursive: true, force: true });
        },
      };
    },

    /** Every photo of a collection, when the collection itself is deleted. */
    async removeCollection(collectionId: string) {
      await fs.rm(folder(collectionId), { recursive: true, force: true });
    },

    /** The stored file's path, or a 404 when the animal has no photo. */
    async file(collectionId: string, animalId: string, size: PhotoSize): Promise<string> {
      const key = await keyOf(collectionId, animalId);
      if (!key) throw new HttpError(404, 'no_photo', 'This animal has no photo yet.');
      return fileOf(collectionId, key, size);
    },

    async remove(collectionId: string, animalId: string) {
      const key = await keyOf(collectionId, animalId);
      await setAnimalPhoto(db, animalId, null, null);
      await removeFiles(collectionId, key);
    },
  };
}
export type PhotosService = ReturnType<typeof createPhotosService>;
