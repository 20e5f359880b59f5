import type { Router } from 'express';
import { createHullSchema } from '../../shared/api/hulls';
import { parseInput } from '../errors';
import { requireUser } from '../http/auth';
import { accessOf, hullAccess } from '../http/hull-access';
import { hullCreate, hullsOf, hullSummary } from '../services/hulls';

export function registerHullRoutes(router: Router) {
  router.get('/api/hulls', requireUser, async (req, res) => {
    res.json({ hulls: await hullsOf(req.user!.id) });
  });

  router.post('/api/hulls', requireUser, async (req, res) => {
    const input = parseInput(createHullSchema, req.body);
    res.status(201).json({ hull: await hullCreate(req.user!.id, input) });
  });

  router.get('/api/hulls/:hullId', hullAccess('read'), async (_req, res) => {
    const { hullId, role } = accessOf(res);
    res.json({ hull: await hullSummary(hullId, role) });
  });
}
