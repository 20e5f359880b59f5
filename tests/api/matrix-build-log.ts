import sharp from 'sharp';
import { configFromEnv } from '../../server/config';
import type { HullAccess } from '../../server/http/hull-access';
import { buildPhotosAdd } from '../../server/services/build-log-photos';
import { defaultPhotoStorage } from '../../server/services/photo-storage';
import type { MatrixFixture, MatrixRow } from './permission-matrix';
import { allCrew, crew, type Caller } from './matrix-statuses';

/**
 * Permission-matrix rows of the build log, spread into `matrix` in permission-matrix.ts. Owner, builder and
 * helper keep the log; the designer only reads it; strangers get 404. The movement tolerance is set by
 * those who may change the parts (owner, builder). A photo is deleted by the owner or a builder, or by the
 * helper who added it: the rows' photo is the owner's, so a helper gets 403 here (their own: build-log.test.ts).
 */
const keepers: Caller[] = ['owner', 'builder', 'helper'];

const tinyPng = () => sharp({ create: { width: 40, height: 30, channels: 3, background: '#b07040' } }).png().toBuffer();

/** A photo on pt-frame-3 of the cell's fresh hull, stored in the same place the app's routes read from. */
async function photoMade(f: MatrixFixture) {
  const access: HullAccess = { hullId: f.hullId, role: 'owner', latestRevisionId: f.revisionId, units: 'mm' };
  const storage = defaultPhotoStorage(configFromEnv(process.env).dataDir);
  const [photo] = await buildPhotosAdd(access, f.people.owner.id, storage, { partId: 'pt-frame-3', stage: 'cut', caption: '', files: [{ buffer: await tinyPng(), originalname: 'm.png' }] });
  return { photoId: photo!.id };
}

export const buildLogMatrix: Record<string, MatrixRow> = {
  'GET /api/hulls/:hullId/build-log': { path: (f) => `/api/hulls/${f.hullId}/build-log`, expect: crew(200, allCrew) },
  'GET /api/hulls/:hullId/build-log/parts/:partId': { path: (f) => `/api/hulls/${f.hullId}/build-log/parts/pt-frame-3`, expect: crew(200, allCrew) },
  'POST /api/hulls/:hullId/build-log/events': {
    path: (f) => `/api/hulls/${f.hullId}/build-log/events`,
    body: () => ({ partId: 'pt-frame-3', layerIndex: 0, stage: 'cut', action: 'done' }),
    expect: crew(201, keepers),
  },
  'PUT /api/hulls/:hullId/build-log/settings': { path: (f) => `/api/hulls/${f.hullId}/build-log/settings`, body: () => ({ moveToleranceMm: 2 }), expect: crew(200, ['owner', 'builder']) },
  'POST /api/hulls/:hullId/build-log/parts/:partId/photos': {
    path: (f) => `/api/hulls/${f.hullId}/build-log/parts/pt-frame-3/photos`,
    prepare: async () => ({ png: await tinyPng() }),
    multipart: (f) => ({ fields: { stage: 'cut' }, files: [{ field: 'photo', name: 'bench.png', content: f.prepared.png as Buffer }] }),
    expect: crew(201, keepers),
  },
  'GET /api/hulls/:hullId/build-log/photos/:photoId': {
    path: (f) => `/api/hulls/${f.hullId}/build-log/photos/${f.prepared.photoId as number}?size=thumb`,
    prepare: photoMade,
    expect: crew(200, allCrew),
  },
  'DELETE /api/hulls/:hullId/build-log/photos/:photoId': {
    path: (f) => `/api/hulls/${f.hullId}/build-log/photos/${f.prepared.photoId as number}`,
    prepare: photoMade,
    expect: crew(204, ['owner', 'builder']),
  },
};
