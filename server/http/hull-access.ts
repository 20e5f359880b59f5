import type { RequestHandler, Response } from 'express';
import { AppError, forbidden, notFound } from '../errors';
import { roleMay, type Capability } from '../services/access';
import { hullMembershipOf, type HullMembership } from '../services/hulls';

export interface HullAccess extends HullMembership {
  hullId: number;
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
    const membership = await hullMembershipOf(hullId, req.user.id);
    if (!membership) throw notFound('No such hull');
    if (!roleMay(membership.role, capability)) throw forbidden();
    res.locals.hullAccess = { hullId, ...membership } satisfies HullAccess;
    next();
  };
}

/** The access that hullAccess() established for this request. */
export function accessOf(res: Response): HullAccess {
  return res.locals.hullAccess as HullAccess;
}
