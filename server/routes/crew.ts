import type { Router } from 'express';
import { addMemberSchema, changeRoleSchema } from '../../shared/api/hulls';
import { notFound, parseInput } from '../errors';
import { accessOf, hullAccess } from '../http/hull-access';
import { crewAdd, crewChangeRole, crewOf, crewRemove } from '../services/crew';

function memberId(raw: string | string[] | undefined): number {
  const id = Number(raw);
  if (!Number.isSafeInteger(id) || id <= 0) throw notFound('That person is not on this crew');
  return id;
}

export function registerCrewRoutes(router: Router) {
  router.get('/api/hulls/:hullId/crew', hullAccess('read'), async (_req, res) => {
    res.json({ crew: await crewOf(accessOf(res).hullId) });
  });

  router.post('/api/hulls/:hullId/crew', hullAccess('manage-crew'), async (req, res) => {
    const input = parseInput(addMemberSchema, req.body);
    res.status(201).json({ member: await crewAdd(accessOf(res).hullId, input.email, input.role) });
  });

  router.patch('/api/hulls/:hullId/crew/:userId', hullAccess('manage-crew'), async (req, res) => {
    const input = parseInput(changeRoleSchema, req.body);
    res.json({ member: await crewChangeRole(accessOf(res).hullId, memberId(req.params.userId), input.role) });
  });

  router.delete('/api/hulls/:hullId/crew/:userId', hullAccess('manage-crew'), async (req, res) => {
    await crewRemove(accessOf(res).hullId, memberId(req.params.userId));
    res.status(204).end();
  });
}
