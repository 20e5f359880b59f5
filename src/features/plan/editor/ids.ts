/**
 * Ids for new stations, lines, parts and longitudinals: readable (`st-4`, `ln-wl-300`) and unique within
 * their list. Derived from the name so that the same edit gives the same id (pure, testable), and never
 * reusing one already taken, since parts and revisions refer to them.
 */
export function idFor(prefix: string, name: string, taken: Iterable<string>): string {
  const used = new Set(taken);
  const slug =
    name
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-|-$/g, '')
      .slice(0, 40) || 'x';
  let id = `${prefix}-${slug}`;
  for (let n = 2; used.has(id); n += 1) id = `${prefix}-${slug}-${n}`;
  return id;
}
