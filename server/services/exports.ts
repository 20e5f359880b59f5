import type { CutListPiece, TemplateDrawing } from '../../shared/geometry/drawing';
import { bevelRowsOf } from '../../shared/geometry/drawing';
import type { PartGeometry } from '../../shared/geometry/frame-types';
import { polygonArea, polygonBounds } from '../../shared/geometry/polygon';
import { AppError } from '../errors';
import { templateDrawingOf } from '../exports/part-drawing';
import { Hull } from '../models';
import { partsOfRevision } from './parts';

/** Everything an export of one hull revision needs: its name, the computed parts, and a drawing maker. */
export async function exportSourceOf(hullId: number, revisionId: number | null, units: 'mm' | 'ftin') {
  if (revisionId === null) throw new AppError(409, 'nothing_saved', 'Save a revision of the plan first: exports are made from saved revisions only, so every pattern names the revision it came from.');
  const hull = await Hull.findByPk(hullId, { attributes: ['name'] });
  const { plan, frames } = await partsOfRevision(hullId, revisionId, units);
  const built = frames.parts.flatMap((r) => (r.ok ? [r.part] : []));
  const date = new Date().toISOString().slice(0, 10);
  const drawingUnits: 'mm' | 'in' = plan.lines.notation.unit === 'mm' ? 'mm' : 'in';
  const clearanceOf = (partId: string) => plan.parts.parts.find((p) => p.id === partId)?.filletClearanceMm ?? null;
  const drawing = (part: PartGeometry, layerIndex: number): TemplateDrawing =>
    templateDrawingOf(part, layerIndex, { hullName: hull?.name ?? '', revisionId, date, units: drawingUnits, filletClearanceMm: clearanceOf(part.partId) });
  return { hullName: hull?.name ?? '', revisionId, date, units: drawingUnits, plan, frames, built, drawing };
}

export type ExportSource = Awaited<ReturnType<typeof exportSourceOf>>;

/** The part to export, or a clear 404 / 409 when it is missing or could not be computed. */
export function builtPart(source: ExportSource, partId: string): PartGeometry {
  const result = source.frames.parts.find((r) => r.partId === partId);
  if (!result) throw new AppError(404, 'not_found', 'No such part in this revision');
  if (!result.ok) throw new AppError(409, 'part_not_built', `${result.name} cannot be drawn until its problems are fixed: ${result.issues[0]?.message ?? ''}`);
  return result.part;
}

/** The drawing of one layer (from 1), or a 400 naming the layer. */
export function layerDrawing(source: ExportSource, part: PartGeometry, layer: number): TemplateDrawing {
  if (layer > part.layers.length) throw new AppError(400, 'no_such_layer', `${part.name} has ${part.layers.length} layer(s); there is no layer ${layer}`, 'layer');
  return source.drawing(part, layer - 1);
}

/** Every layer of every built part. */
export function allDrawings(source: ExportSource): TemplateDrawing[] {
  return source.built.flatMap((part) => part.layers.map((_, i) => source.drawing(part, i)));
}

/** Bevel rows for every part and layer (the bevel table). */
export function allBevelRows(source: ExportSource) {
  return allDrawings(source).flatMap((d) => bevelRowsOf(d));
}

/** The cut list: every piece of every layer, with its bounding size, area and mass. */
export function cutListPieces(source: ExportSource): CutListPiece[] {
  const pieces: CutListPiece[] = [];
  for (const part of source.built) {
    for (const layer of part.layers) {
      const figures = part.estimate.layers.find((l) => l.index === layer.index);
      const layerArea = figures?.areaMm2 ?? 0;
      layer.pieces.pieces.forEach((piece, k) => {
        const b = polygonBounds(piece.outer);
        if (!b) return;
        const area = polygonArea(piece.outer) - piece.holes.reduce((s, h) => s + polygonArea(h), 0);
        pieces.push({
          partName: part.name,
          partKind: part.kind.replace(/-/g, ' '),
          layerIndex: layer.index + 1,
          pieceNo: k + 1,
          plyThicknessMm: layer.thicknessMm,
          widthMm: b.maxY - b.minY,
          heightMm: b.maxZ - b.minZ,
          areaMm2: area,
          // The layer's mass shared out by area (the estimate knows the density, the piece knows its share).
          massKg: figures?.massKg && layerArea > 0 ? (figures.massKg * area) / layerArea : 0,
          grain: part.marks.grain?.direction ?? null,
          outline: piece,
        });
      });
    }
  }
  return pieces;
}
