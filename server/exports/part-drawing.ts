import type { DrawingBevelMark, DrawingLabel, DrawingPath, TemplateDrawing } from '../../shared/geometry/drawing';
import type { PartGeometry, PartLevelLine } from '../../shared/geometry/frame-types';

/** What the drawing's title block says that the part itself does not know. */
export interface DrawingContext {
  hullName: string;
  revisionId: number | null;
  date: string;
  units: 'mm' | 'in';
  filletClearanceMm: number | null;
}

const LABEL_MM = 8;

function levelPath(role: DrawingPath['role'], line: PartLevelLine | null): DrawingPath[] {
  return line ? [{ kind: 'polyline', role, points: [line.from, line.to], closed: false }] : [];
}

function levelLabel(text: string, line: PartLevelLine | null): DrawingLabel[] {
  return line ? [{ anchor: { y: line.to.y + 10, z: line.to.z + 2 }, text, heightMm: LABEL_MM * 0.75, rotationDeg: 0, align: 'start', purpose: 'line' }] : [];
}


/**
 * The template of one layer of a part, in the writers' neutral drawing: the layer's outline cut at its
 * near face (outer cut and inner cut), its far face dashed, and the marks of the marked face (centreline,
 * level lines, grain, bevel marks with their readings, notch and limber centres, the check dimension).
 */
export function templateDrawingOf(part: PartGeometry, layerIndex: number, ctx: DrawingContext): TemplateDrawing {
  const layer = part.layers[layerIndex];
  if (!layer) throw new Error(`templateDrawingOf: part ${part.partId} has no layer ${layerIndex}`);
  const paths: DrawingPath[] = [];
  for (const region of layer.regions) {
    paths.push({ kind: 'polyline', role: 'outer-cut', points: region.outer, closed: true });
    for (const hole of region.holes) paths.push({ kind: 'polyline', role: 'inner-cut', points: hole, closed: true });
  }
  for (const region of layer.otherFaceRegions) {
    paths.push({ kind: 'polyline', role: 'other-face', points: region.outer, closed: true });
    for (const hole of region.holes) paths.push({ kind: 'polyline', role: 'other-face', points: hole, closed: true });
  }
  const m = part.marks;
  paths.push({ kind: 'polyline', role: 'centreline', points: [m.centreline.from, m.centreline.to], closed: false });
  paths.push(...levelPath('level-line', m.levelLine), ...levelPath('waterline', m.designWaterline), ...levelPath('set-up-line', m.setUpLine));
  if (m.grain) paths.push({ kind: 'polyline', role: 'grain', points: [m.grain.from, m.grain.to], closed: false });

  const b = part.bounds;
  const labels: DrawingLabel[] = [
    { anchor: { y: 0, z: b.maxZ + 3 * LABEL_MM }, text: part.stationName ? `${part.name} · ${part.stationName}` : part.name, heightMm: LABEL_MM * 1.5, rotationDeg: 0, align: 'centre', purpose: 'station' },
    { anchor: { y: 0, z: b.maxZ + LABEL_MM }, text: `${m.faceLabel} (marked face)`, heightMm: LABEL_MM, rotationDeg: 0, align: 'centre', purpose: 'face' },
    ...levelLabel(`Level line ${Math.round(m.levelLine.heightMm)} mm above base`, m.levelLine),
    ...levelLabel('DWL', m.designWaterline),
    ...levelLabel('Set-up line', m.setUpLine),
  ];
  if (ctx.filletClearanceMm) {
    labels.push({ anchor: { y: 0, z: b.minZ - 2 * LABEL_MM }, text: `Cut line includes a ${ctx.filletClearanceMm} mm fillet clearance to the skin`, heightMm: LABEL_MM * 0.75, rotationDeg: 0, align: 'centre', purpose: 'fillet' });
  }

  const bevelMarks: DrawingBevelMark[] = part.bevelMarks.map((mark, i) => {
    const sideSign = mark.side === 'starboard' ? 1 : -1;
    // The table tilts down toward the offcut (the outward side): in words, toward or away from the centreline.
    const tiltDirection = mark.kind === 'square' ? 'none' : mark.ny * sideSign >= 0 ? 'away-from-centreline' : 'toward-centreline';
    return {
      markNo: i + 1,
      at: { y: mark.y, z: mark.z },
      inward: { y: -mark.ny, z: -mark.nz },
      girthMm: mark.girthMm,
      side: mark.side,
      sawTiltDeg: mark.bevelDeg,
      slidingBevelDeg: mark.slidingBevelDeg,
      kind: mark.kind,
      tiltDirection,
      largerFace: mark.largerFace,
      overSawLimit: mark.overLimit,
    };
  });

  return {
    title: {
      hullName: ctx.hullName,
      partName: part.name,
      partKind: part.kind.replace(/-/g, ' '),
      stationName: part.stationName ?? '',
      layerIndex: layerIndex + 1,
      layerCount: part.layers.length,
      plyThicknessMm: layer.thicknessMm,
      face: part.markedFace,
      revisionId: ctx.revisionId === null ? 'not saved' : String(ctx.revisionId),
      date: ctx.date,
      units: ctx.units,
      filletClearanceMm: ctx.filletClearanceMm,
    },
    paths,
    labels,
    bevelMarks,
    centres: [
      ...part.notches.map((n) => ({ kind: 'notch' as const, at: n.centre, label: n.name })),
      ...part.limbers.map((l) => ({ kind: 'limber' as const, at: l.centre, label: `limber r${l.radiusMm}` })),
    ],
    checkDimension: part.checkDimension ? { from: part.checkDimension.from, to: part.checkDimension.to, lengthMm: part.checkDimension.lengthMm } : null,
  };
}

