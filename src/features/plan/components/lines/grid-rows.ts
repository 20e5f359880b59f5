import type { Line } from '../../../../../shared/geometry/hull-schema';
import type { Notation } from '../../../../../shared/geometry/notation-schema';
import { lengthFormat } from '../../../../../shared/geometry/notation';
import { radToDeg } from '../../../../../shared/geometry/types';
import type { CellField } from '../../editor/types';

/** One row of the table: a line, and for a point line which of its two values (height, then half-breadth, as in a table of offsets). */
export interface GridRowSpec {
  key: string;
  lineId: string;
  field: CellField;
}

/** The rows for the lines, in table order. */
export function gridRowSpecs(lines: readonly Pick<Line, 'id' | 'kind'>[]): GridRowSpec[] {
  return lines.flatMap((line): GridRowSpec[] =>
    line.kind === 'point'
      ? [
          { key: `${line.id}:z`, lineId: line.id, field: 'z' },
          { key: `${line.id}:y`, lineId: line.id, field: 'y' },
        ]
      : [{ key: `${line.id}:value`, lineId: line.id, field: 'value' }],
  );
}

export const pointRoleWords = { sheer: 'Sheer', chine: 'Chine', keel: 'Keel', other: 'Point line' } as const;

/** The row header's second line: kind and fixed value, e.g. "Waterline · height 300", "Chine · half-breadth". */
export function rowHeaderDetail(line: Line, field: CellField, notation: Notation): string {
  const length = (mm: number) => lengthFormat(mm, notation);
  switch (line.kind) {
    case 'waterline':
      return `Waterline · height ${length(line.z)}`;
    case 'buttock':
      return `Buttock · half-breadth ${length(line.y)}`;
    case 'diagonal':
      return `Diagonal · from height ${length(line.originZ)} at ${Number(radToDeg(line.angle).toFixed(1))}°`;
    case 'point': {
      // "Chine / height" rather than "Chine / Chine · height"; the role is said when the name does not say it.
      const role = pointRoleWords[line.role];
      const half = field === 'z' ? 'height' : 'half-breadth';
      return line.name.toLowerCase().includes(role.toLowerCase()) ? half : `${role} · ${half}`;
    }
  }
}

/** An id safe in the DOM for a cell's message, from its line, station and field. */
export function messageId(prefix: string, lineId: string, stationId: string, field: CellField): string {
  const clean = (s: string) => s.replace(/[^A-Za-z0-9_-]/g, (c) => `_${c.charCodeAt(0).toString(16)}`);
  return `${prefix}-${clean(lineId)}--${clean(stationId)}--${field}`;
}
