import { randomUUID } from 'node:crypto';
import { fileTypeFromBuffer } from 'file-type';
import { Op } from 'sequelize';
import sharp, { type OutputInfo } from 'sharp';
import type { BuildPhoto, BuildStage } from '../../shared/api/build-log';
import { AppError, forbidden, notFound } from '../errors';
import type { HullAccess } from '../http/hull-access';
import { BuildPhotoRow, User } from '../models';
import { partsOfRevision } from './parts';
import type { PhotoStorage } from './photo-storage';

/** Photos are kept at most this size on the long side, and thumbnails fit this square. */
const PHOTO_LONG_SIDE_PX = 2400;
export const THUMB_SIDE_PX = 320;
const ACCEPTED_IMAGES = new Set(['image/jpeg', 'image/png', 'image/webp']);

/** The two files stored for one photo row: the re-encoded photo and its thumbnail. */
export function photoFileKeys(storageKey: string): { full: string; thumb: string } {
  return { full: `${storageKey}.jpg`, thumb: `${storageKey}.thumb.jpg` };
}

/** The row's storage key a stored file belongs to, or null for a file that is not a photo's. */
function storageKeyOfFile(fileKey: string): string | null {
  const match = /^(.+?)(\.thumb)?\.jpg$/.exec(fileKey);
  return match ? match[1]! : null;
}

export type PhotoWithUploader = BuildPhotoRow & { uploader?: User };

export function photoOut(row: PhotoWithUploader): BuildPhoto {
  return {
    id: row.id,
    partId: row.partId,
    stage: row.stage,
    caption: row.caption,
    width: row.width,
    height: row.height,
    thumbWidth: row.thumbWidth,
    thumbHeight: row.thumbHeight,
    uploader: { id: row.uploaderId, displayName: row.uploader?.displayName ?? '' },
    createdAt: row.createdAt.toISOString(),
  };
}

export interface UploadedFile {
  buffer: Buffer;
  originalname: string;
}

/**
 * Attach photos to a part. Every file is checked and re-encoded before anything is stored, so a refused
 * file leaves nothing behind; files are stored before the rows, and removed again if the rows fail.
 */
export async function buildPhotosAdd(
  access: HullAccess,
  uploaderId: number,
  storage: PhotoStorage,
  input: { partId: string; stage: BuildStage | null; caption: string; files: readonly UploadedFile[] },
): Promise<BuildPhoto[]> {
  if (input.files.length === 0) throw new AppError(400, 'no_file', 'Choose a photo to attach', 'photo');
  const { frames } = await partsOfRevision(access.hullId, access.latestRevisionId, access.units);
  if (!frames.parts.some((p) => p.partId === input.partId)) throw notFound(`The plan has no part ${input.partId}`);
  type Encoded = { data: Buffer; info: OutputInfo };
  const prepared: { key: string; full: Encoded; thumb: Encoded }[] = [];
  for (const file of input.files) {
    // The name and the browser's type say nothing reliable: the bytes decide.
    const sniffed = await fileTypeFromBuffer(file.buffer);
    if (!sniffed || !ACCEPTED_IMAGES.has(sniffed.mime)) {
      throw new AppError(415, 'not_an_image', `${file.originalname} is not a JPEG, PNG or WebP photo${sniffed ? ` (it is ${sniffed.mime})` : ''}. Nothing was attached.`, 'photo');
    }
    try {
      // rotate() applies the camera's orientation before the metadata (GPS included) is dropped by re-encoding.
      const full = await sharp(file.buffer).rotate().resize(PHOTO_LONG_SIDE_PX, PHOTO_LONG_SIDE_PX, { fit: 'inside', withoutEnlargement: true }).jpeg({ quality: 85 }).toBuffer({ resolveWithObject: true });
      const thumb = await sharp(full.data).resize(THUMB_SIDE_PX, THUMB_SIDE_PX, { fit: 'inside', withoutEnlargement: true }).jpeg({ quality: 75 }).toBuffer({ resolveWithObject: true });
      prepared.push({ key: randomUUID(), full, thumb });
    } catch {
      throw new AppError(415, 'bad_image', `${file.originalname} could not be read as an image. Nothing was attached.`, 'photo');
    }
  }
  const written: string[] = [];
  try {
    for (const p of prepared) {
      const keys = photoFileKeys(p.key);
      for (const [key, bytes] of [[keys.full, p.full.data], [keys.thumb, p.thumb.data]] as const) {
        await storage.put(key, bytes);
        written.push(key);
      }
    }
    const sequelize = BuildPhotoRow.sequelize!;
    const rows = await sequelize.transaction((transaction) =>
      Promise.all(
        prepared.map((p) =>
          BuildPhotoRow.create(
            {
              hullId: access.hullId,
              partId: input.partId,
              stage: input.stage,
              caption: input.caption,
              storageKey: p.key,
              width: p.full.info.width,
              height: p.full.info.height,
              thumbWidth: p.thumb.info.width,
              thumbHeight: p.thumb.info.height,
              uploaderId,
            },
            { transaction },
          ),
        ),
      ),
    );
    const uploader = await User.findByPk(uploaderId, { attributes: ['id', 'displayName'] });
    return rows.map((r) => photoOut(Object.assign(r, { uploader: uploader ?? undefined })));
  } catch (err) {
    await Promise.all(written.map((key) => storage.delete(key).catch(() => undefined)));
    throw err;
  }
}

/** A photo's bytes (full size or thumbnail), only for this hull's crew. */
export async function buildPhotoBytes(access: HullAccess, storage: PhotoStorage, photoId: number, size: 'full' | 'thumb'): Promise<Buffer> {
  const row = await BuildPhotoRow.findOne({ where: { id: photoId, hullId: access.hullId } });
  if (!row) throw notFound('No such photo');
  const bytes = await storage.get(photoFileKeys(row.storageKey)[size]);
  if (!bytes) throw new AppError(500, 'photo_missing', 'The photo file is missing from storage', undefined, false);
  return bytes;
}

/** Where a file that could not be removed is reported; the sweep removes it later. */
export interface PhotoLog {
  warn(details: Record<string, unknown>, message: string): void;
}

/**
 * Delete a photo. The owner and builders may delete any photo of the hull; a helper only the photos they
 * added (a helper tidies their own shots, but the record others made is not theirs to remove).
 * The row goes first, in its own transaction, and the files after it commits: a row is never left pointing
 * at a missing file. A file that cannot be removed is logged, not an error: the photo is gone for the
 * crew, and `photoSweep` removes the file later since no row names it.
 */
export async function buildPhotoDelete(access: HullAccess, userId: number, storage: PhotoStorage, photoId: number, log: PhotoLog): Promise<void> {
  const storageKey = await BuildPhotoRow.sequelize!.transaction(async (transaction) => {
    const row = await BuildPhotoRow.findOne({ where: { id: photoId, hullId: access.hullId }, transaction, lock: transaction.LOCK.UPDATE });
    if (!row) throw notFound('No such photo');
    if (access.role === 'helper' && row.uploaderId !== userId) throw forbidden('A helper may delete only the photos they added; ask the owner or a builder');
    await row.destroy({ transaction });
    return row.storageKey;
  });
  for (const key of Object.values(photoFileKeys(storageKey))) {
    try {
      await storage.delete(key);
    } catch (err) {
      log.warn({ err, key, photoId }, 'photo file not removed; the next sweep removes it');
    }
  }
}

/**
 * An hour: files younger than this are left alone by the sweep, because an upload stores its files before
 * it inserts their rows, and a sweep must not take the files of an upload still under way.
 */
export const SWEEP_GRACE_MS = 60 * 60 * 1000;
const KEYS_PER_QUERY = 500;

/**
 * Remove stored files that no photo row names. Rows also go by cascade, without this code seeing them:
 * deleting a hull takes its photo rows with it, and so does deleting the account that uploaded them
 * (see 0005-build-log). Rather than every such path collecting keys first, this sweep (at start-up and
 * on a schedule, server/index.ts) finds what is left, whatever removed the row.
 * @returns the file keys removed.
 */
export async function photoSweep(storage: PhotoStorage, options: { graceMs?: number; now?: number; log?: PhotoLog } = {}): Promise<string[]> {
  const { graceMs = SWEEP_GRACE_MS, now = Date.now(), log } = options;
  const old = (await storage.list()).filter((f) => f.modifiedAt.getTime() <= now - graceMs);
  const known = new Set<string>();
  const storageKeys = [...new Set(old.map((f) => storageKeyOfFile(f.key)).filter((k): k is string => k !== null))];
  for (let i = 0; i < storageKeys.length; i += KEYS_PER_QUERY) {
    const rows = await BuildPhotoRow.findAll({ where: { storageKey: { [Op.in]: storageKeys.slice(i, i + KEYS_PER_QUERY) } }, attributes: ['storageKey'] });
    for (const r of rows) known.add(r.storageKey);
  }
  const removed: string[] = [];
  for (const f of old) {
    const owner = storageKeyOfFile(f.key);
    if (owner !== null && known.has(owner)) continue;
    try {
      await storage.delete(f.key);
      removed.push(f.key);
    } catch (err) {
      log?.warn({ err, key: f.key }, 'orphaned photo file not removed; the next sweep tries again');
    }
  }
  return removed;
}
