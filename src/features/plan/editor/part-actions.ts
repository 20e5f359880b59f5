import type { Longitudinal, Part } from '../../../../shared/geometry/part-schema';
import type { Plan } from '../../../../shared/geometry/plan-schema';
import { jsonEqual, withParts } from './plan-update';

/** Add a part (its id must be new). */
export function partAdd(plan: Plan, args: { part: Part }): Plan {
  return withParts(plan, (parts) => (parts.parts.some((p) => p.id === args.part.id) ? parts : { ...parts, parts: [...parts.parts, args.part] }));
}

/** Replace the part with the same id. */
export function partUpdate(plan: Plan, args: { part: Part }): Plan {
  return withParts(plan, (parts) => {
    const index = parts.parts.findIndex((p) => p.id === args.part.id);
    if (index < 0 || jsonEqual(parts.parts[index], args.part)) return parts;
    const all = [...parts.parts];
    all[index] = args.part;
    return { ...parts, parts: all };
  });
}

export function partDelete(plan: Plan, args: { partId: string }): Plan {
  return withParts(plan, (parts) => (parts.parts.some((p) => p.id === args.partId) ? { ...parts, parts: parts.parts.filter((p) => p.id !== args.partId) } : parts));
}

export function longitudinalAdd(plan: Plan, args: { longitudinal: Longitudinal }): Plan {
  return withParts(plan, (parts) =>
    parts.longitudinals.some((l) => l.id === args.longitudinal.id) ? parts : { ...parts, longitudinals: [...parts.longitudinals, args.longitudinal] },
  );
}

export function longitudinalUpdate(plan: Plan, args: { longitudinal: Longitudinal }): Plan {
  return withParts(plan, (parts) => {
    const index = parts.longitudinals.findIndex((l) => l.id === args.longitudinal.id);
    if (index < 0 || jsonEqual(parts.longitudinals[index], args.longitudinal)) return parts;
    const all = [...parts.longitudinals];
    all[index] = args.longitudinal;
    return { ...parts, longitudinals: all };
  });
}

/**
 * Delete a longitudinal, and take it off every part's list of notches and every mould's list of what it
 * carries, so no part points at something that is gone.
 */
export function longitudinalDelete(plan: Plan, args: { longitudinalId: string }): Plan {
  const id = args.longitudinalId;
  return withParts(plan, (parts) => {
    if (!parts.longitudinals.some((l) => l.id === id)) return parts;
    const cleaned = parts.parts.map((part): Part => {
      let next = part;
      if (next.longitudinalIds?.includes(id)) next = { ...next, longitudinalIds: next.longitudinalIds.filter((l) => l !== id) };
      if (next.kind === 'mould' && next.carriesIds.includes(id)) next = { ...next, carriesIds: next.carriesIds.filter((l) => l !== id) };
      return next;
    });
    return { ...parts, longitudinals: parts.longitudinals.filter((l) => l.id !== id), parts: cleaned };
  });
}
