import type { Camber } from '../../../../shared/geometry/camber-schema';
import type { Deck, HullLines, Skin } from '../../../../shared/geometry/hull-schema';
import type { Notation } from '../../../../shared/geometry/notation-schema';
import type { Plan } from '../../../../shared/geometry/plan-schema';
import { jsonEqual, withLines } from './plan-update';

function lineSetting<K extends keyof HullLines>(plan: Plan, key: K, value: HullLines[K]): Plan {
  return withLines(plan, (lines) => (jsonEqual(lines[key], value) ? lines : { ...lines, [key]: value }));
}

/** How lengths of this hull are written: unit, decimal comma, sixteenth marks, precision shown. */
export function notationSet(plan: Plan, args: Partial<Notation>): Plan {
  return lineSetting(plan, 'notation', { ...plan.lines.notation, ...args });
}

/** Skin: offsets to its outside or inside, its thickness, panels of other thicknesses, sheathing. */
export function skinSet(plan: Plan, args: Partial<Skin>): Plan {
  return lineSetting(plan, 'skin', { ...plan.lines.skin, ...args });
}

/** The deck (null: an open boat, no deck). */
export function deckSet(plan: Plan, args: { deck: Deck | null }): Plan {
  return lineSetting(plan, 'deck', args.deck);
}

/** The deck's camber; no change without a deck. */
export function camberSet(plan: Plan, args: { camber: Camber }): Plan {
  const deck = plan.lines.deck;
  return deck ? lineSetting(plan, 'deck', { ...deck, camber: args.camber }) : plan;
}

/** Which way x runs, and the height of the design waterline (drawn on templates). */
export function linesSettingsSet(plan: Plan, args: Partial<Pick<HullLines, 'xDirection' | 'designWaterlineZ'>>): Plan {
  let next = plan;
  if (args.xDirection !== undefined) next = lineSetting(next, 'xDirection', args.xDirection);
  if (args.designWaterlineZ !== undefined) next = lineSetting(next, 'designWaterlineZ', args.designWaterlineZ);
  return next;
}
