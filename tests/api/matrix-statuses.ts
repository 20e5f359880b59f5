/**
 * The callers of the permission matrix and the usual status patterns, shared by every matrix file.
 * Crew members lacking the capability get 403; strangers 404 (a hull's existence is not revealed);
 * anonymous callers 401.
 */
export const callers = ['owner', 'builder', 'designer', 'helper', 'stranger', 'anonymous'] as const;
export type Caller = (typeof callers)[number];

export const everyone = (status: number): Record<Caller, number> => ({ owner: status, builder: status, designer: status, helper: status, stranger: status, anonymous: status });
export const signedInOnly = (status: number): Record<Caller, number> => ({ ...everyone(status), anonymous: 401 });
export const crew = (ok: number, allowed: Caller[]): Record<Caller, number> => ({
  owner: allowed.includes('owner') ? ok : 403,
  builder: allowed.includes('builder') ? ok : 403,
  designer: allowed.includes('designer') ? ok : 403,
  helper: allowed.includes('helper') ? ok : 403,
  stranger: 404,
  anonymous: 401,
});
export const allCrew: Caller[] = ['owner', 'builder', 'designer', 'helper'];
/** Who may change the lines: owner, builder, designer. */
export const editors: Caller[] = ['owner', 'builder', 'designer'];
