import type { Router } from 'express';
import multer from 'multer';
import { buildEventSchema, buildSettingsSchema, photoFieldsSchema, PHOTO_MAX_BYTES, PHOTO_MAX_FILES } from '../../shared/api/build-log';
import type { Config } from '../config';
import { AppError, notFound, parseInput } from '../errors';
import { accessOf, hullAccess } from '../http/hull-access';
import { buildBoard, buildEventAdd, buildPart, buildSettingsPut } from '../services/build-log';
import { buildPhotoBytes, buildPhotoDelete, buildPhotosAdd } from '../services/build-log-photos';
import { defaultPhotoStorage, type PhotoStorage } from '../services/photo-storage';

// Memory storage: a refused upload never touches the disk, and the bytes are sniffed before anything is kept.
const photoUpload = multer({ storage: multer.memoryStorage(), limits: { fileSize: PHOTO_MAX_BYTES, files: PHOTO_MAX_FILES, fields: 5 } }).array('photo', PHOTO_MAX_FILES);

export function registerBuildLogRoutes(router: Router, config: Config, storage: PhotoStorage = defaultPhotoStorage(config.dataDir)) {
  router.get('/api/hulls/:hullId/build-log', hullAccess('read'), async (_req, res) => {
    res.json(await buildBoard(accessOf(res)));
  });

  router.get('/api/hulls/:hullId/build-log/parts/:partId', hullAccess('read'), async (req, res) => {
    res.json(await buildPart(accessOf(res), String(req.params.partId)));
  });

  router.post('/api/hulls/:hullId/build-log/events', hullAccess('build-log'), async (req, res) => {
    const input = parseInput(buildEventSchema, req.body);
    res.status(201).json({ event: await buildEventAdd(accessOf(res), req.user!.id, input) });
  });

  // The tolerance decides which cut parts must be checked again: a decision about the parts, so it is for
  // those who may change them (owner, builders), not for everyone who keeps the log.
  router.put('/api/hulls/:hullId/build-log/settings', hullAccess('edit-parts'), async (req, res) => {
    const { moveToleranceMm } = parseInput(buildSettingsSchema, req.body);
    res.json(await buildSettingsPut(accessOf(res).hullId, moveToleranceMm));
  });

  router.post('/api/hulls/:hullId/build-log/parts/:partId/photos', hullAccess('build-log'), async (req, res) => {
    await new Promise<void>((resolve, reject) =>
      photoUpload(req, res, (err: unknown) => {
        if (err instanceof multer.MulterError && err.code === 'LIMIT_FILE_SIZE') {
          return reject(new AppError(413, 'file_too_large', `A photo may be at most ${PHOTO_MAX_BYTES / 1024 / 1024} MB. Nothing was attached.`, 'photo'));
        }
        if (err instanceof multer.MulterError && (err.code === 'LIMIT_FILE_COUNT' || err.code === 'LIMIT_UNEXPECTED_FILE')) {
          return reject(new AppError(400, 'too_many_files', `Attach at most ${PHOTO_MAX_FILES} photos at once, in the field "photo". Nothing was attached.`, 'photo'));
        }
        if (err instanceof multer.MulterError) return reject(new AppError(400, 'bad_upload', `Upload refused: ${err.message}`, err.field ?? 'photo'));
        if (err) return reject(err);
        resolve();
      }),
    );
    const fields = parseInput(photoFieldsSchema, req.body ?? {});
    const files = (req.files as Express.Multer.File[] | undefined) ?? [];
    const photos = await buildPhotosAdd(accessOf(res), req.user!.id, storage, { partId: String(req.params.partId), stage: fields.stage || null, caption: fields.caption, files });
    res.status(201).json({ photos });
  });

  router.get('/api/hulls/:hullId/build-log/photos/:photoId', hullAccess('read'), async (req, res) => {
    const photoId = photoIdOf(req.params.photoId);
    const bytes = await buildPhotoBytes(accessOf(res), storage, photoId, req.query.size === 'thumb' ? 'thumb' : 'full');
    res.set('Cache-Control', 'private, max-age=86400').type('image/jpeg').send(bytes);
  });

  router.delete('/api/hulls/:hullId/build-log/photos/:photoId', hullAccess('build-log'), async (req, res) => {
    await buildPhotoDelete(accessOf(res), req.user!.id, storage, photoIdOf(req.params.photoId), req.log);
    res.status(204).end();
  });
}

function photoIdOf(param: unknown): number {
  const photoId = Number(param);
  if (!Number.isSafeInteger(photoId) || photoId <= 0) throw notFound('No such photo');
  return photoId;
}
