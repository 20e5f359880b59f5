import type { Camber, Crown } from '../../../../shared/geometry/camber-schema';
import type { LibraryKind, Visibility } from '../../../../shared/api/library';

// Our words for the Library's choices (DESIGN.md section 9: Library, Take into hull, Revision).

export const kindLabels: Record<LibraryKind, string> = { camber: 'Camber curve', lines: 'Lines' };

export const shapeLabels: Record<Camber['shape'], string> = { parabola: 'Parabola', arc: 'Circular arc', custom: 'Own points' };

export const crownKindLabels: Record<Crown['kind'], string> = {
  rise: 'Rise at a stated beam',
  'percent-of-beam': 'Percent of the beam',
  'per-foot': 'Rise per foot of beam',
};

export const conventionLabels: Record<Camber['convention'], string> = {
  'one-pattern': 'One pattern for every station',
  scaled: 'Scaled to each station’s beam',
};

export const visibilityLabels: Record<Visibility, string> = {
  private: 'Private: only me',
  shared: 'Shared with the people I name',
  public: 'Public: anyone with an account',
};

/** A crown in words, e.g. "60 mm at a 1860 mm beam". */
export function crownWords(crown: Crown): string {
  if (crown.kind === 'rise') return `${crown.riseMm} mm at a ${crown.referenceBeamMm} mm beam`;
  if (crown.kind === 'percent-of-beam') return `${crown.percent} % of the beam`;
  return `${crown.inchesPerFoot} in per foot of beam`;
}

/** A length for tables: millimetres to one decimal. */
export function mmWords(value: number | null): string {
  return value === null ? '—' : `${value.toFixed(1)} mm`;
}
