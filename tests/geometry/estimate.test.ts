import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  G_PER_M2_PER_OZ_PER_YD2,
  ML_PER_US_GALLON,
  OKOUME_DENSITY_KG_PER_M3,
  type PartEstimateInput,
  estimateHull,
  estimatePart,
  filletCrossSectionMm2,
  filletRadiusRecommendedMm,
  glassClothResinGallons,
  glassClothResinMl,
} from '../../shared/geometry/estimate';
import { filletSchema } from '../../shared/geometry/part-schema';
import { type Shape, polygonArea } from '../../shared/geometry/polygon';
import { GeometryInputError, type SectionPoint } from '../../shared/geometry/types';
import { MM_PER_FOOT } from '../../shared/geometry/units';
import { expectClose } from './helpers';

const rectangle = (w: number, h: number): SectionPoint[] => [{ y: 0, z: 0 }, { y: w, z: 0 }, { y: w, z: h }, { y: 0, z: h }];
const circle = (r: number, n: number, cy: number, cz: number): SectionPoint[] =>
  Array.from({ length: n }, (_, i) => ({ y: cy - r * Math.cos((2 * Math.PI * i) / n), z: cz + r * Math.sin((2 * Math.PI * i) / n) }));

describe('filletCrossSectionMm2', () => {
  it('is r^2 (1 - pi/4)', () => {
    // derived (REFERENCES.md, Epoxy fillets and glass)
    expectClose(filletCrossSectionMm2(9.525), 19.47, 0.005);
    expectClose(filletCrossSectionMm2(15), 48.29, 0.005);
    expectClose(filletCrossSectionMm2(22), 103.87, 0.005);
    expect(filletCrossSectionMm2(0)).toBe(0);
  });

  it('refuses a negative or missing radius', () => {
    expect(() => filletCrossSectionMm2(-1)).toThrow(GeometryInputError);
    expect(() => filletCrossSectionMm2(Number.NaN)).toThrow(/finite length/);
  });
});

describe('filletRadiusRecommendedMm', () => {
  it('follows the published table for 4, 5 and 6 mm ply', () => {
    // published: Gougeon 2005, p. 103, fig. 11-18
    expect(filletRadiusRecommendedMm(4, 'high-density')).toBe(15);
    expect(filletRadiusRecommendedMm(5, 'high-density')).toBe(18);
    expect(filletRadiusRecommendedMm(6, 'high-density')).toBe(22);
    for (const t of [4, 5, 6]) expect(filletRadiusRecommendedMm(t, 'low-density')).toBe(44);
  });

  it('interpolates between the rows and gives null outside them', () => {
    // linear between the published rows (our reading)
    expectClose(filletRadiusRecommendedMm(4.5, 'high-density')!, 16.5, 1e-12);
    expectClose(filletRadiusRecommendedMm(5.5, 'high-density')!, 20, 1e-12);
    // no published value outside 4 to 6 mm
    expect(filletRadiusRecommendedMm(9, 'high-density')).toBeNull();
    expect(filletRadiusRecommendedMm(3, 'low-density')).toBeNull();
    expect(filletRadiusRecommendedMm(Number.NaN, 'high-density')).toBeNull();
  });
});

describe('glassClothResinGallons and glassClothResinMl', () => {
  it('give 0.99 gal for 56 ft^2 of 12 oz cloth', () => {
    // published: Epoxyworks magazine, B. Niederer
    expectClose(glassClothResinGallons(56, 12), 0.99, 0.005);
  });

  it('give the same resin in metric units', () => {
    // analytic: 1 US gallon = 231 in^3; 1 oz/yd^2 = 28.349523125 g / 0.83612736 m^2 (exact definitions)
    expectClose(ML_PER_US_GALLON, 3785.411784, 1e-6);
    expectClose(G_PER_M2_PER_OZ_PER_YD2, 33.9057, 1e-4);
    const areaMm2 = 56 * MM_PER_FOOT * MM_PER_FOOT;
    expectClose(glassClothResinMl(areaMm2, 12 * G_PER_M2_PER_OZ_PER_YD2), glassClothResinGallons(56, 12) * 3785.411784, 1e-6);
    // published figure again, in litres: 0.99 gal is about 3.75 l
    expectClose(glassClothResinMl(areaMm2, 12 * G_PER_M2_PER_OZ_PER_YD2) / 1000, 3.75, 0.02);
  });

  it('is linear in the area', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1000, noNaN: true }), fc.double({ min: 1, max: 40, noNaN: true }), (a, w) => {
        // analytic: the formula is A times a function of Wf
        expectClose(glassClothResinGallons(2 * a, w), 2 * glassClothResinGallons(a, w), 1e-9);
      }),
    );
    expect(() => glassClothResinGallons(10, 0)).toThrow(/cloth weight/);
  });
});

/** A bulkhead 1000 x 500 with a lightening hole of radius 100: invented fixture. */
const hole = circle(100, 720, 500, 250);
const bulkhead: Shape = { outer: rectangle(1000, 500), holes: [hole] };
const bulkheadArea = 1000 * 500 - polygonArea(hole);
const input = (over: Partial<PartEstimateInput> = {}): PartEstimateInput => ({
  partId: 'b2',
  thicknessMm: 9,
  layers: [{ thicknessMm: 9, material: 'plywood', densityKgPerM3: null }],
  layerShapes: [[bulkhead]],
  jointLengthMm: 2000,
  filletClearanceMm: 2,
  fillet: filletSchema.parse({ radiusMm: 15 }),
  ...over,
});

describe('estimatePart', () => {
  it('weighs a 9 mm okoume square metre at about 4.1 kg', () => {
    const e = estimatePart(input({ layerShapes: [[{ outer: rectangle(1000, 1000), holes: [] }]] }));
    // common practice (suppliers' data): okoume about 450 kg/m^3, 9 mm sheet about 4.1 kg/m^2
    expect(OKOUME_DENSITY_KG_PER_M3).toBe(450);
    expectClose(e.massKg!, 4.05, 1e-9);
    expectClose(e.massKg!, 4.1, 0.06);
  });

  it('measures each layer net of its holes and cuts round them', () => {
    const e = estimatePart(input());
    // analytic: rectangle less the hole polygon; cut length is both
    expectClose(e.layers[0]!.areaMm2, bulkheadArea, 1e-6);
    // analytic: the 720-gon hole is short of the circle by about 2 pi^3 r^2 / (3 n^2) = 0.40 mm^2
    expectClose(e.layers[0]!.areaMm2, 500000 - 360 * 100 * 100 * Math.sin((2 * Math.PI) / 720), 1e-6);
    expectClose(e.layers[0]!.areaMm2, 500000 - Math.PI * 100 * 100, 0.5);
    expectClose(e.layers[0]!.perimeterMm, 3000 + 2 * 720 * 100 * Math.sin(Math.PI / 720), 1e-6);
    expectClose(e.massKg!, bulkheadArea * 9 * 450e-9, 1e-12);
  });

  it('puts a cove on each face plus the clearance gap across the thickness into the fillet', () => {
    const e = estimatePart(input());
    // derived (REFERENCES.md): r = 15 gives 48.29 mm^2, i.e. ml per metre per face; 2 m, two faces;
    // the model's clearance term: 2 mm gap * 9 mm thickness * 2 m = 36 ml
    expectClose(e.fillet!.coveMm2PerFace, 48.29, 0.005);
    expectClose(e.fillet!.clearanceMm2, 18, 1e-12);
    expectClose(e.fillet!.volumeMl, 2 * 2 * 48.29 + 36, 0.02);
    const one = estimatePart(input({ fillet: filletSchema.parse({ radiusMm: 15, sides: 'one' }) }));
    expectClose(one.fillet!.volumeMl, 2 * 48.29 + 36, 0.01);
    expect(estimatePart(input({ fillet: filletSchema.parse({ sides: 'none' }) })).fillet).toBeNull();
  });

  it('takes the published radius for the thinner of skin and layer when none is given', () => {
    const six = estimatePart(input({ thicknessMm: 6, layers: [{ thicknessMm: 6, material: 'plywood', densityKgPerM3: null }], fillet: filletSchema.parse({}) }));
    // published: Gougeon 2005, p. 103, fig. 11-18 (6 mm ply, high-density filler: 22 mm)
    expect(six.fillet!.radiusMm).toBe(22);
    const skin = estimatePart(input({ fillet: filletSchema.parse({}), skinThicknessMm: 4 }));
    expect(skin.fillet!.radiusMm).toBe(15);
    const none = estimatePart(input({ fillet: filletSchema.parse({}) }));
    expect(none.fillet).toBeNull();
    expect(none.issues.map((i) => i.code)).toEqual(['estimate-fillet-radius']);
  });

  it('counts glass tape along the joint, per face and ply, and the resin to wet it', () => {
    const e = estimatePart(input({ fillet: filletSchema.parse({ radiusMm: 15, tapePlies: 2, tapeWidthMm: 75 }) }), { tapeWeightGPerM2: 300 });
    // analytic: 2000 mm * 2 faces * 2 plies; area * width
    expectClose(e.tape!.lengthMm, 8000, 1e-12);
    expectClose(e.tape!.areaMm2, 600000, 1e-9);
    // published formula (Epoxyworks, B. Niederer) in metric
    expectClose(e.tape!.resinMl, glassClothResinMl(600000, 300), 1e-9);
    expect(e.tape!.resinMl).toBeGreaterThan(0);
  });

  it('estimates resin for glass cloth on the faces when asked', () => {
    const e = estimatePart(input(), { clothFaces: 2, clothWeightGPerM2: 200 });
    expectClose(e.cloth!.areaMm2, 2 * bulkheadArea, 1e-6);
    expectClose(e.cloth!.resinMl, glassClothResinMl(2 * bulkheadArea, 200), 1e-9);
    expect(() => estimatePart(input(), { clothFaces: 1 })).toThrow(/cloth weight/);
  });

  it('leaves the mass of timber without a density unknown, and says so', () => {
    const e = estimatePart(input({ layers: [{ thicknessMm: 9, material: 'timber', densityKgPerM3: null }] }));
    expect(e.massKg).toBeNull();
    expect(e.issues.map((i) => i.field)).toEqual(['layers.0.densityKgPerM3']);
    const given = estimatePart(input({ layers: [{ thicknessMm: 9, material: 'timber', densityKgPerM3: 600 }] }));
    expectClose(given.massKg!, bulkheadArea * 9 * 600e-9, 1e-12);
  });

  it('refuses a negative joint length and shapes that do not pair with the layers', () => {
    expect(() => estimatePart(input({ jointLengthMm: -1 }))).toThrow(/joint length/);
    expect(() => estimatePart(input({ layerShapes: [] }))).toThrow(/1 layers but shapes for 0/);
  });
});

describe('estimateHull', () => {
  it('adds up the parts and ply area per thickness', () => {
    const a = estimatePart(input());
    const b = estimatePart(input({ partId: 'b3', fillet: filletSchema.parse({ radiusMm: 15, tapePlies: 1 }) }));
    const c = estimatePart(input({ partId: 'k1', layers: [{ thicknessMm: 9, material: 'timber', densityKgPerM3: null }] }));
    const h = estimateHull([a, b, c]);
    // analytic: sums
    expect(h.parts).toBe(3);
    expectClose(h.massKg, a.massKg! + b.massKg!, 1e-12);
    expect(h.massUnknownPartIds).toEqual(['k1']);
    expectClose(h.filletMl, a.fillet!.volumeMl + b.fillet!.volumeMl + c.fillet!.volumeMl, 1e-9);
    expectClose(h.tapeLengthMm, 4000, 1e-9);
    expectClose(h.resinMl, b.tape!.resinMl, 1e-9);
    expectClose(h.plyAreaByThicknessMm2['9']!, 2 * bulkheadArea, 1e-6);
    expect(h.issues).toHaveLength(1);
  });
});
