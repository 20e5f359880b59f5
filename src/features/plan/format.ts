import type { Notation } from '../../../shared/geometry/notation-schema';
import { lengthFormat } from '../../../shared/geometry/notation';
import type { PlanChange } from '../../../shared/geometry/plan-compare';
import { radToDeg } from '../../../shared/geometry/types';

/** The notation for showing and typing in `unit` (the hull's own, or the other one chosen for the screen). */
export function notationIn(notation: Notation, unit: Notation['unit']): Notation {
  if (unit === notation.unit) return notation;
  return { ...notation, unit, precision: unit === 'mm' ? '0.5mm' : '1/16in' };
}

/** A length that stands alone (a heading, a list): "1049.5 mm", "41 5/16"", "3-5-2+". */
export function lengthWords(mm: number, notation: Notation): string {
  return lengthFormat(mm, notation, { unitMark: true });
}

/** A fairness deviation, signed, with the unit: "+25.4 mm" (and inches for an imperial hull). */
export function deviationWords(mm: number, notation: Notation): string {
  const sign = mm > 0 ? '+' : mm < 0 ? '−' : '±';
  const metric = `${sign}${Math.abs(mm).toFixed(1)} mm`;
  if (notation.unit === 'mm') return metric;
  const inches = lengthFormat(Math.abs(mm), { ...notation, unit: 'in', precision: '1/32in' }, { unitMark: true });
  return `${sign}${inches} (${metric})`;
}

/** The same, short enough for a table cell: millimetres, or inches alone for an imperial hull. */
export function deviationShort(mm: number, notation: Notation): string {
  const sign = mm > 0 ? '+' : mm < 0 ? '−' : '±';
  if (notation.unit === 'mm') return `${sign}${Math.abs(mm).toFixed(1)} mm`;
  return `${sign}${lengthFormat(Math.abs(mm), { ...notation, unit: 'in', precision: '1/32in' }, { unitMark: true })}`;
}

/** A point of a section: "half-breadth 612 mm, height 790 mm". */
export function pointWords(p: { y: number; z: number }, notation: Notation): string {
  return `half-breadth ${lengthWords(p.y, notation)}, height ${lengthWords(p.z, notation)}`;
}

export function degreesWords(rad: number): string {
  return `${Number(radToDeg(rad).toFixed(1))}°`;
}

const lengthKeys = /(^|\.)(x|y|z|originZ|fromX|toX|topZ|pivotZ|designWaterlineZ|levelLineZ|setUpLineZ|[a-zA-Z]*Mm)$/;
const angleKeys = /(^|\.)(angle|[a-zA-Z]*Rad)$/;

function valueWords(path: string, value: unknown, notation: Notation): string {
  if (value === null || value === undefined) return 'empty';
  if (typeof value === 'number') {
    if (angleKeys.test(path)) return degreesWords(value);
    if (lengthKeys.test(path) || path.includes('.cells.')) return lengthWords(value, notation);
    return String(Number(value.toFixed(4)));
  }
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (typeof value === 'string') return value;
  if (Array.isArray(value)) return value.length === 0 ? 'none' : `${value.length} item${value.length === 1 ? '' : 's'}`;
  const object = value as Record<string, unknown>;
  if (typeof object.y === 'number' && typeof object.z === 'number' && Object.keys(object).length === 2) {
    return pointWords({ y: object.y, z: object.z }, notation);
  }
  if (typeof object.name === 'string') {
    const where = typeof object.x === 'number' ? ` at x ${lengthWords(object.x, notation)}` : '';
    return `${object.name}${where}`;
  }
  return 'set';
}

/** A change of the plan as a person reads it: what, and before → after in the hull's notation. */
export function changeWords(change: PlanChange, notation: Notation): { label: string; before: string; after: string } {
  return { label: change.label, before: valueWords(change.path, change.before, notation), after: valueWords(change.path, change.after, notation) };
}
