import type { HullUnits, Role } from '../../shared/api/hulls';

export const roleLabels: Record<Role, string> = {
  owner: 'Owner',
  builder: 'Builder',
  designer: 'Designer',
  helper: 'Helper',
};

/** What each role may do on a hull, in plain words (DESIGN.md section 7). */
export const roleAbilities: Record<Role, string> = {
  owner: 'Everything on this hull, and manages the crew.',
  builder: 'Reads and edits the plan, lines, offsets and camber; prints, downloads and keeps the build log.',
  designer: 'Reads the plan and edits lines, offsets and camber; prints and downloads. No build log.',
  helper: 'Reads the plan, prints patterns, reads the bevel table and keeps the build log. Changes nothing in the plan.',
};

export const unitsLabels: Record<HullUnits, string> = {
  mm: 'Millimetres',
  ftin: 'Feet-inches-eighths',
};

const dateTime = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short' });

/** A server timestamp as a person reads it; the raw text if it does not parse. */
export function formatWhen(iso: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : dateTime.format(date);
}
