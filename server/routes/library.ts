import type { Request, Router } from 'express';
import { movePinSchema, newRevisionSchemas, publishItemSchema, takeIntoHullSchema, updateSharingSchema } from '../../shared/api/library';
import type { Config } from '../config';
import { notFound, parseInput } from '../errors';
import { requireUser } from '../http/auth';
import { accessOf, hullAccess } from '../http/hull-access';
import { mailLinkBase } from '../mail/links';
import { mailerOf } from '../mail/mailer';
import { libraryDetail, libraryList, libraryPublish, libraryRevise, libraryRevisionGet, librarySharingUpdate, type ReviseRequest } from '../services/library';
import { itemForAuthor, type Viewer } from '../services/library-access';
import { pinCompare, pinMove, pinsOf, pinTake } from '../services/library-pins';

function idParam(raw: unknown, what: string): number {
  const id = Number(raw);
  if (typeof raw !== 'string' || !/^\d+$/.test(raw) || !Number.isSafeInteger(id) || id <= 0) throw notFound(`No such ${what}`);
  return id;
}

const viewerOf = (req: Request): Viewer => ({ id: req.user!.id, email: req.user!.email });

export function registerLibraryRoutes(router: Router, config: Config) {
  router.get('/api/library', requireUser, async (req, res) => {
    res.json({ items: await libraryList(viewerOf(req)) });
  });

  router.post('/api/library', requireUser, async (req, res) => {
    const input = parseInput(publishItemSchema, req.body);
    res.status(201).json({ item: await libraryPublish(viewerOf(req), input) });
  });

  router.get('/api/library/:itemId', requireUser, async (req, res) => {
    res.json({ item: await libraryDetail(viewerOf(req), idParam(req.params.itemId, 'item in the Library')) });
  });

  router.patch('/api/library/:itemId', requireUser, async (req, res) => {
    const itemId = idParam(req.params.itemId, 'item in the Library');
    await itemForAuthor(itemId, viewerOf(req));
    const { sharing } = parseInput(updateSharingSchema, req.body);
    res.json({ item: await librarySharingUpdate(viewerOf(req), itemId, sharing) });
  });

  router.post('/api/library/:itemId/revisions', requireUser, async (req, res) => {
    const itemId = idParam(req.params.itemId, 'item in the Library');
    // Who may publish is settled before the body is read: a stranger learns nothing from a 400.
    const item = await itemForAuthor(itemId, viewerOf(req));
    const input: ReviseRequest = item.kind === 'camber' ? parseInput(newRevisionSchemas.camber, req.body) : parseInput(newRevisionSchemas.lines, req.body);
    const published = await libraryRevise(viewerOf(req), itemId, input, { mailer: mailerOf(req.app), linkBase: mailLinkBase(config, req) });
    res.status(201).json(published);
  });

  router.get('/api/library/:itemId/revisions/:revisionId', requireUser, async (req, res) => {
    res.json({ revision: await libraryRevisionGet(viewerOf(req), idParam(req.params.itemId, 'item in the Library'), idParam(req.params.revisionId, 'revision of this item')) });
  });

  router.get('/api/hulls/:hullId/pins', hullAccess('read'), async (req, res) => {
    res.json({ pins: await pinsOf(accessOf(res).hullId, viewerOf(req)) });
  });

  router.post('/api/hulls/:hullId/pins', hullAccess('edit-lines'), async (req, res) => {
    const input = parseInput(takeIntoHullSchema, req.body);
    res.status(201).json(await pinTake(accessOf(res), viewerOf(req), input));
  });

  router.get('/api/hulls/:hullId/pins/:pinId/compare', hullAccess('read'), async (req, res) => {
    const pinId = idParam(req.params.pinId, 'Library pin on this hull');
    const to = idParam(req.query.to, 'revision of this item');
    res.json(await pinCompare(accessOf(res), viewerOf(req), pinId, to));
  });

  router.post('/api/hulls/:hullId/pins/:pinId/move', hullAccess('edit-lines'), async (req, res) => {
    const input = parseInput(movePinSchema, req.body);
    res.status(201).json(await pinMove(accessOf(res), viewerOf(req), idParam(req.params.pinId, 'Library pin on this hull'), input));
  });
}
