import { cutPartIds } from './build-log';

/**
 * The seam to the build log: which parts of a hull are already cut (their `cut` stage is marked done and
 * not reopened), read from the build log's events.
 */
export const CUT_PARTS_KNOWN = true;

export async function cutPartIdsOf(hullId: number): Promise<ReadonlySet<string>> {
  return cutPartIds(hullId);
}
