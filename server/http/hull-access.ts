import type { RequestHandler, Response } from 'express';
import type { Role } from '../../shared/api/hulls';
import { AppError, forbidden, notFound } from '../errors';
import { roleMay, type Capability } from '../services/access';
import { hullRoleOf } from '../services/hulls';

export interface HullAccess {
  hullId: number;
  role: Role;
}

/**
 * Guard for routes under /api/hulls/:hullId. A person who is not on the crew learns nothing, not even that
 * the hull exists: 404. A member whose role lacks the capability gets 403.
 */
export function hullAccess(capability: Capability): RequestHandler {
  return async (req, res, next) => {
    if (!req.user) throw new AppError(401, 'not_signed_in', 'Sign in to continue');
    const hullId = Number(req.params.hullId);
    if (!Number.isSafeInteger(hullId) || hullId <= 0) throw notFound('No such hull');
    const role = await hullRoleOf(hullId, req.user.id);
    if (!role) throw notFound('No such hull');
    if (!roleMay(role, capability)) throw forbidden();
    res.locals.hullAccess = { hullId, role } satisfies HullAccess;
    next();
  };
}

/** The access that hullAccess() established for this request. */
export function accessOf(res: Response): HullAccess {
  return res.locals.hullAccess as HullAccess;
}
