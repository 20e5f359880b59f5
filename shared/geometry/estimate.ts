import type { Fillet, Layer } from './part-schema';
import { type Shape, shapeArea, shapePerimeter } from './polygon';
import { GeometryInputError, type GeometryIssue } from './types';
import { MM_PER_FOOT, MM_PER_INCH } from './units';

/**
 * Estimates of material per part and per hull: ply area and mass, epoxy in the fillets, glass tape and the
 * resin to wet it and any glass cloth. Lengths mm, areas mm^2, volumes ml (1 ml = 1000 mm^3), mass kg.
 *
 * Fillet model: along the joint between frame and skin, each filleted face holds a cove fillet of radius r
 * (the concave quarter-round between two surfaces at right angles: r^2 (1 - pi/4) per unit length), and
 * the fillet clearance c left between the frame's edge and the skin is filled across the frame's whole
 * thickness T (c * T per unit length, once). Volume = joint length * (faces * r^2 (1 - pi/4) + c * T).
 * A frame standing at an angle to the skin makes one fillet larger and the other smaller; to first order
 * they cancel, so the square-joint figure is used.
 */

/** Okoume plywood, about 450 kg/m^3 (9 mm sheet about 4.1 kg/m^2): common practice (suppliers' data). */
export const OKOUME_DENSITY_KG_PER_M3 = 450;
/** Default glass tape weight (g/m^2): a common biaxial tape of about 9 oz/yd^2 (from memory). */
export const DEFAULT_TAPE_WEIGHT_G_PER_M2 = 300;
/** Grams per square metre in one ounce per square yard: 28.349523125 g / 0.83612736 m^2 (exact definitions). */
export const G_PER_M2_PER_OZ_PER_YD2 = 28.349523125 / 0.83612736;
/** Millilitres in one US gallon (231 in^3). */
export const ML_PER_US_GALLON = 231 * MM_PER_INCH ** 3 / 1000;

const fail = (code: string, field: string, value: unknown, message: string): never => {
  throw new GeometryInputError([{ code, message, field, value }]);
};

/** Cross-section (mm^2) of a cove fillet of radius r (mm): r^2 (1 - pi/4); also ml per metre of joint per face. */
export function filletCrossSectionMm2(radiusMm: number): number {
  if (!Number.isFinite(radiusMm) || radiusMm < 0) fail('fillet-radius', 'radiusMm', radiusMm, `the fillet radius must be a finite length of 0 mm or more, found ${radiusMm}`);
  return radiusMm * radiusMm * (1 - Math.PI / 4);
}

// Gougeon 2005, p. 103, fig. 11-18: fillet radius so that the plywood fails before the joint.
const HIGH_DENSITY_RADIUS: readonly [number, number][] = [[4, 15], [5, 18], [6, 22]];
const LOW_DENSITY_RADIUS_MM = 44;

/**
 * Fillet radius (mm) so that the plywood fails before the joint, from Gougeon 2005, p. 103, fig. 11-18:
 * high-density filler 15 mm for 4 mm ply, 18 for 5, 22 for 6; low-density filler 44 for all three.
 * Between the tabulated thicknesses the radius is interpolated linearly (our reading, not the book's);
 * outside 4 to 6 mm there is no published value and the answer is null.
 */
export function filletRadiusRecommendedMm(plyThicknessMm: number, filler: Fillet['filler']): number | null {
  if (!Number.isFinite(plyThicknessMm) || plyThicknessMm < 4 || plyThicknessMm > 6) return null;
  if (filler === 'low-density') return LOW_DENSITY_RADIUS_MM;
  for (let i = 1; i < HIGH_DENSITY_RADIUS.length; i++) {
    const [t0, r0] = HIGH_DENSITY_RADIUS[i - 1]!;
    const [t1, r1] = HIGH_DENSITY_RADIUS[i]!;
    if (plyThicknessMm <= t1) return r0 + ((plyThicknessMm - t0) / (t1 - t0)) * (r1 - r0);
  }
  return null;
}

/**
 * Resin (US gallons) to wet out glass cloth, in the published US units: A * (Wf * 0.00085 + 0.0075), A the
 * cloth area in ft^2, Wf the cloth weight in oz/yd^2. Published: Epoxyworks magazine, B. Niederer.
 */
export function glassClothResinGallons(areaFt2: number, weightOzPerYd2: number): number {
  if (!Number.isFinite(areaFt2) || areaFt2 < 0) fail('cloth-area', 'areaFt2', areaFt2, `the cloth area must be 0 or more, found ${areaFt2}`);
  if (!Number.isFinite(weightOzPerYd2) || weightOzPerYd2 <= 0) fail('cloth-weight', 'weightOzPerYd2', weightOzPerYd2, `the cloth weight must be more than 0, found ${weightOzPerYd2}`);
  return areaFt2 * (weightOzPerYd2 * 0.00085 + 0.0075);
}

/** The same resin estimate in metric: cloth area in mm^2, weight in g/m^2, resin in ml. */
export function glassClothResinMl(areaMm2: number, weightGPerM2: number): number {
  return glassClothResinGallons(areaMm2 / (MM_PER_FOOT * MM_PER_FOOT), weightGPerM2 / G_PER_M2_PER_OZ_PER_YD2) * ML_PER_US_GALLON;
}

/** What the estimate needs of one part: its layers (schema) and their cut shapes, the joint to the skin. */
export interface PartEstimateInput {
  partId: string;
  thicknessMm: number;
  layers: readonly Pick<Layer, 'thicknessMm' | 'material' | 'densityKgPerM3'>[];
  /** The shapes of each layer (all its pieces), index for index with `layers`. */
  layerShapes: readonly (readonly Shape[])[];
  /** Length (mm) of the edge bonded to the skin, along which fillets and tape run. */
  jointLengthMm: number;
  filletClearanceMm: number;
  fillet: Fillet;
  /** Skin thickness (mm) for the recommended fillet radius; null: the frame's own thinnest layer is used. */
  skinThicknessMm?: number | null;
}

/** Options of `estimatePart`. */
export interface EstimateOptions {
  /** Density of plywood layers with none of their own (kg/m^3). */
  plyDensityKgPerM3?: number;
  tapeWeightGPerM2?: number;
  /** Faces of the part covered in glass cloth (0, 1 or 2) and the cloth's weight (g/m^2). */
  clothFaces?: 0 | 1 | 2;
  clothWeightGPerM2?: number;
}

/** One layer's figures. */
export interface LayerEstimate {
  index: number;
  thicknessMm: number;
  material: Layer['material'];
  /** Face area net of holes (mm^2) and the length of every cut edge, holes included (mm). */
  areaMm2: number;
  perimeterMm: number;
  densityKgPerM3: number | null;
  massKg: number | null;
}

/** A part's figures; null where an input was missing, with an issue saying which. */
export interface PartEstimate {
  partId: string;
  layers: LayerEstimate[];
  massKg: number | null;
  fillet: { radiusMm: number; faces: number; coveMm2PerFace: number; clearanceMm2: number; volumeMl: number } | null;
  tape: { lengthMm: number; areaMm2: number; resinMl: number } | null;
  cloth: { areaMm2: number; resinMl: number } | null;
  issues: GeometryIssue[];
}

/**
 * Material for one part: per layer the face area net of holes, cut length and mass (area * thickness *
 * density); the fillet volume by the model in the file's note (radius from the part, else recommended
 * for the thinner of skin and layer); glass tape length (joint length * faces * plies), its area and
 * resin; resin for glass cloth on `clothFaces` faces (the outermost layers' areas).
 * @throws GeometryInputError for a negative or non-finite joint length, or layers and shapes that do not pair up.
 */
export function estimatePart(input: PartEstimateInput, options: EstimateOptions = {}): PartEstimate {
  const plyDensity = options.plyDensityKgPerM3 ?? OKOUME_DENSITY_KG_PER_M3;
  const issues: GeometryIssue[] = [];
  if (!Number.isFinite(input.jointLengthMm) || input.jointLengthMm < 0) {
    fail('estimate-joint-length', 'jointLengthMm', input.jointLengthMm, `part ${input.partId}: the joint length must be 0 mm or more, found ${input.jointLengthMm}`);
  }
  if (input.layerShapes.length !== input.layers.length) {
    fail('estimate-layers', 'layerShapes', input.layerShapes.length, `part ${input.partId}: ${input.layers.length} layers but shapes for ${input.layerShapes.length}`);
  }
  const layers = input.layers.map((layer, index): LayerEstimate => {
    const shapes = input.layerShapes[index]!;
    const areaMm2 = shapes.reduce((a, s) => a + shapeArea(s), 0);
    const perimeterMm = shapes.reduce((a, s) => a + shapePerimeter(s), 0);
    const density = layer.densityKgPerM3 ?? (layer.material === 'plywood' ? plyDensity : null);
    if (density === null) {
      issues.push({ code: 'estimate-density', message: `part ${input.partId}: layer ${index + 1} is timber with no density given, so its mass is not estimated`, field: `layers.${index}.densityKgPerM3`, value: null });
    }
    // mm^3 -> m^3 is 1e-9.
    const massKg = density === null ? null : areaMm2 * layer.thicknessMm * density * 1e-9;
    return { index, thicknessMm: layer.thicknessMm, material: layer.material, areaMm2, perimeterMm, densityKgPerM3: density, massKg };
  });
  const massKg = layers.some((l) => l.massKg === null) ? null : layers.reduce((a, l) => a + l.massKg!, 0);

  const faces = input.fillet.sides === 'both' ? 2 : input.fillet.sides === 'one' ? 1 : 0;
  let fillet: PartEstimate['fillet'] = null;
  if (faces > 0) {
    const thinnest = Math.min(...input.layers.map((l) => l.thicknessMm), input.skinThicknessMm ?? Infinity);
    const radiusMm = input.fillet.radiusMm ?? filletRadiusRecommendedMm(thinnest, input.fillet.filler);
    if (radiusMm === null) {
      issues.push({ code: 'estimate-fillet-radius', message: `part ${input.partId}: no published fillet radius for ${thinnest} mm ply; give the fillet radius to estimate the fillets`, field: 'fillet.radiusMm', value: null });
    } else {
      const coveMm2PerFace = filletCrossSectionMm2(radiusMm);
      const clearanceMm2 = input.filletClearanceMm * input.thicknessMm;
      const volumeMl = (input.jointLengthMm * (faces * coveMm2PerFace + clearanceMm2)) / 1000;
      fillet = { radiusMm, faces, coveMm2PerFace, clearanceMm2, volumeMl };
    }
  }

  const tapeWeight = options.tapeWeightGPerM2 ?? DEFAULT_TAPE_WEIGHT_G_PER_M2;
  let tape: PartEstimate['tape'] = null;
  if (faces > 0 && input.fillet.tapePlies > 0) {
    const lengthMm = input.jointLengthMm * faces * input.fillet.tapePlies;
    const areaMm2 = lengthMm * input.fillet.tapeWidthMm;
    tape = { lengthMm, areaMm2, resinMl: glassClothResinMl(areaMm2, tapeWeight) };
  }

  const clothFaces = options.clothFaces ?? 0;
  let cloth: PartEstimate['cloth'] = null;
  if (clothFaces > 0 && layers.length > 0) {
    const areaMm2 = layers[0]!.areaMm2 + (clothFaces === 2 ? layers[layers.length - 1]!.areaMm2 : 0);
    const weight = options.clothWeightGPerM2;
    if (weight === undefined) fail('estimate-cloth-weight', 'clothWeightGPerM2', weight, `part ${input.partId}: give the glass cloth weight to estimate its resin`);
    cloth = { areaMm2, resinMl: glassClothResinMl(areaMm2, weight!) };
  }
  return { partId: input.partId, layers, massKg, fillet, tape, cloth, issues };
}

/** A hull's totals: sums of the parts' figures; `massKg` counts only the parts whose mass is known. */
export interface HullEstimate {
  parts: number;
  massKg: number;
  massUnknownPartIds: string[];
  filletMl: number;
  tapeLengthMm: number;
  resinMl: number;
  /** Ply face area needed per layer thickness (mm^2), for ordering sheets; key is the thickness in mm. */
  plyAreaByThicknessMm2: Record<string, number>;
  issues: GeometryIssue[];
}

/** Totals over a hull's part estimates (`resinMl` is the tape's and cloth's wet-out; fillet epoxy is `filletMl`). */
export function estimateHull(parts: readonly PartEstimate[]): HullEstimate {
  const byThickness: Record<string, number> = {};
  for (const p of parts) {
    for (const l of p.layers) if (l.material === 'plywood') byThickness[String(l.thicknessMm)] = (byThickness[String(l.thicknessMm)] ?? 0) + l.areaMm2;
  }
  return {
    parts: parts.length,
    massKg: parts.reduce((a, p) => a + (p.massKg ?? 0), 0),
    massUnknownPartIds: parts.filter((p) => p.massKg === null).map((p) => p.partId),
    filletMl: parts.reduce((a, p) => a + (p.fillet?.volumeMl ?? 0), 0),
    tapeLengthMm: parts.reduce((a, p) => a + (p.tape?.lengthMm ?? 0), 0),
    resinMl: parts.reduce((a, p) => a + (p.tape?.resinMl ?? 0) + (p.cloth?.resinMl ?? 0), 0),
    plyAreaByThicknessMm2: byThickness,
    issues: parts.flatMap((p) => p.issues),
  };
}
