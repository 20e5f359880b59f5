/**
 * Serialised plan documents by revision id. A revision never changes after it is written, so an entry can
 * never be stale: the cache only saves the decompression and the JSON round trip on every read. Bounded
 * by total size, least recently used out first.
 */
export interface CachedRevision {
  /** RevisionSummary as JSON. */
  metaJson: string;
  /** The plan document as JSON. */
  planJson: string;
}

const MAX_BYTES = 64 * 1024 * 1024;
const entries = new Map<number, CachedRevision>();
let bytes = 0;

const sizeOf = (e: CachedRevision) => e.metaJson.length + e.planJson.length;

/** The entry under `id`, moved to the back: a Map iterates in insertion order, so its first key is the least recently used. */
function touched<V>(map: Map<number, V>, id: number): V | undefined {
  const hit = map.get(id);
  if (hit !== undefined) {
    map.delete(id);
    map.set(id, hit);
  }
  return hit;
}

export function revisionCacheGet(id: number): CachedRevision | undefined {
  return touched(entries, id);
}

export function revisionCachePut(id: number, entry: CachedRevision) {
  if (entries.has(id)) return;
  entries.set(id, entry);
  bytes += sizeOf(entry);
  for (const [key, old] of entries) {
    if (bytes <= MAX_BYTES) break;
    entries.delete(key);
    bytes -= sizeOf(old);
  }
}

/**
 * Parsed plans of the last few revisions. A save compares the new plan with its base, which is nearly always
 * the revision the same person saved a moment before: keeping that one parsed spares parsing ~50 KB of JSON
 * on every save. Deep-frozen, because it is shared between requests: a change to it would be a change to a
 * revision.
 */
const PARSED_MAX = 64;
const parsed = new Map<number, unknown>();

export function revisionPlanGet(id: number): unknown {
  return touched(parsed, id);
}

/** Keep `plan` (frozen here, in place) as the parsed document of revision `id`. */
export function revisionPlanPut(id: number, plan: unknown) {
  parsed.set(id, deepFreeze(plan));
  if (parsed.size > PARSED_MAX) parsed.delete(parsed.keys().next().value!);
}

function deepFreeze<T>(value: T): T {
  if (value !== null && typeof value === 'object' && !Object.isFrozen(value)) {
    Object.freeze(value);
    for (const v of Object.values(value)) deepFreeze(v);
  }
  return value;
}
