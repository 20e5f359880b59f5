import type { LibraryDocument, LibraryKind, LinesDrawing } from '../../../../shared/api/library';
import { camberHeightAt, camberReferenceHalfBeamMm } from '../../../../shared/geometry/camber';
import type { Camber } from '../../../../shared/geometry/camber-schema';
import { hullCheck } from '../../../../shared/geometry/hull';
import type { HullLines } from '../../../../shared/geometry/hull-schema';
import { sectionAt } from '../../../../shared/geometry/section';
import { BodyPlanDrawing } from './body-plan-drawing';
import { CamberDrawing } from './camber-drawing';

/** Half-beam a camber given as a share of the beam is drawn over when there is no hull to take it from. */
export const PREVIEW_HALF_BEAM_MM = 1000;

/** The points of a camber pattern over its half-beam, or null when the curve cannot be drawn (the reason is shown by the form). */
export function camberPoints(camber: Camber, hullHalfBeamMm = PREVIEW_HALF_BEAM_MM): { halfBeamMm: number; points: { y: number; z: number }[] } | null {
  try {
    const b = camberReferenceHalfBeamMm(camber, hullHalfBeamMm);
    const points = Array.from({ length: 81 }, (_, k) => {
      const y = (b * (k - 40)) / 40;
      return { y, z: camberHeightAt(camber, y, b, b) };
    });
    return { halfBeamMm: b, points };
  } catch {
    return null;
  }
}

/** The body plan of one set of lines, or null when they do not build a hull. */
export function linesPoints(lines: HullLines): LinesDrawing | null {
  const built = hullCheck(lines);
  if (!built.ok) return null;
  const stations = [...lines.stations]
    .sort((a, b) => a.x - b.x)
    .map((st) => {
      const section = sectionAt(built.hull, st.x);
      return { name: st.name, x: st.x, before: section ? section.vertices.map((v) => ({ y: v.y, z: v.z })) : null, after: null };
    });
  return { kind: 'lines', stations };
}

/** One published curve or set of lines, drawn. */
export function DocumentPreview({ kind, document, label }: { kind: LibraryKind; document: LibraryDocument; label: string }) {
  if (kind === 'camber') {
    const camber = document as Camber;
    const drawn = camberPoints(camber);
    if (!drawn) return <p className="text-muted">This curve cannot be drawn.</p>;
    return (
      <div className="flex flex-col gap-1">
        <CamberDrawing curves={[{ points: drawn.points, label, tone: 'after' }]} halfBeamMm={drawn.halfBeamMm} title={`${label}: the camber pattern`} />
        {camber.crown.kind !== 'rise' && <p className="text-sm text-muted">Drawn over a {2 * PREVIEW_HALF_BEAM_MM} mm beam: this crown is given as a share of each hull’s own beam.</p>}
      </div>
    );
  }
  const drawing = linesPoints(document as HullLines);
  if (!drawing) return <p className="text-muted">These lines do not build a hull, so they cannot be drawn.</p>;
  return <BodyPlanDrawing drawing={drawing} title={`${label}: body plan`} beforeLabel={label} afterLabel={null} />;
}
