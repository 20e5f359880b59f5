import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  DEFAULT_SAW_TILT_LIMIT_RAD,
  type PartInput,
  type PartsInput,
  longitudinalSchema,
  partIssues,
  partSchema,
  partsIssues,
  partsParse,
  partsSchema,
} from '../../shared/geometry/part-schema';
import { degToRad } from '../../shared/geometry/types';

// Invented fixtures: one of every kind of part.
const base = { name: 'Frame 3', stationId: 's3', thicknessMm: 18, layers: [{ thicknessMm: 9 }, { thicknessMm: 9 }] };
const fixtures: PartInput[] = [
  { ...base, id: 'f3', kind: 'ring-frame', ringWidth: { bottomMm: 120, sidesMm: 60, underDeckMm: 50 } },
  { ...base, id: 'b5', name: 'Bulkhead 5', kind: 'bulkhead', openings: [{ shape: 'rectangle', y: 0, z: 400, widthMm: 400, heightMm: 500, cornerRadiusMm: 60 }] },
  { ...base, id: 'pb2', name: 'Partial bulkhead 2', kind: 'partial-bulkhead', topZ: 450 },
  { ...base, id: 'fl1', name: 'Floor 1', kind: 'floor', topZ: 250, limbers: [{ girthMm: 80, radiusMm: 12 }] },
  { ...base, id: 'db6', name: 'Deck beam 6', kind: 'deck-beam', mouldedDepthMm: 70, taper: { endDepthMm: 45, fromFraction: 0.5 } },
  { ...base, id: 'hb7', name: 'Half beam 7', kind: 'half-beam', mouldedDepthMm: 60, inboardEnd: { by: 'carlin', carlinId: 'carlin' } },
  { ...base, id: 'm4', name: 'Mould 4', kind: 'mould', carriesIds: ['rib1'] },
  { ...base, id: 'tr', name: 'Transom', kind: 'transom', rakeRad: degToRad(12), pivotZ: 150 },
  {
    id: 'mf',
    name: 'Frame 8 as built',
    kind: 'measured-frame',
    x: 3210,
    measuredFace: 'aft',
    symmetry: 'mirror-starboard',
    thicknessMm: 12,
    layers: [{ thicknessMm: 12 }],
    measurement: { kind: 'offsets', referenceZ: 600, points: [{ y: 0, h: -500, bevel: { readingRad: degToRad(80), sense: 'under' } }, { y: 400, h: -300 }, { y: 700, h: 0 }] },
  },
];
const longitudinals: PartsInput['longitudinals'] = [
  { id: 'chine', name: 'Chine log', kind: 'stringer', placement: { by: 'line', lineId: 'chine' }, widthMm: 40, depthMm: 25 },
  { id: 'clamp', name: 'Sheer clamp', kind: 'clamp', placement: { by: 'line', lineId: 'sheer', girthOffsetMm: -20 }, widthMm: 45, depthMm: 30 },
  { id: 'hog', name: 'Hog', kind: 'hog', placement: { by: 'girth', girthMm: 0 }, widthMm: 120, depthMm: 30, sides: 'centreline' },
  { id: 'carlin', name: 'Cockpit carlin', kind: 'carlin', placement: { by: 'half-breadth', y: 450 }, widthMm: 35, depthMm: 50, against: 'deck', fromX: 2000, toX: 3800 },
  { id: 'rib1', name: 'Ribband 1', kind: 'ribband', placement: { by: 'height', z: 300 }, widthMm: 20, depthMm: 20 },
];
const hull = { stations: ['s3'].map((id) => ({ id })), lines: [{ id: 'chine', kind: 'point' }, { id: 'sheer', kind: 'point' }, { id: 'wl1', kind: 'waterline' }] };

/** The messages of a part that fails to parse. */
const messages = (part: unknown): string[] => {
  const r = partsParse({ parts: [part] });
  if (r.ok) throw new Error('expected the part to be refused');
  return r.issues.map((i) => i.message);
};

describe('partsSchema', () => {
  it('defaults to no longitudinals and no parts', () => {
    expect(partsSchema.parse({})).toEqual({ longitudinals: [], parts: [] });
  });

  it('takes one of every kind of part and survives a JSON round trip', () => {
    const parsed = partsSchema.parse({ longitudinals, parts: fixtures });
    expect(parsed.parts.map((p) => p.kind)).toEqual(['ring-frame', 'bulkhead', 'partial-bulkhead', 'floor', 'deck-beam', 'half-beam', 'mould', 'transom', 'measured-frame']);
    expect(partsSchema.parse(JSON.parse(JSON.stringify(parsed)))).toEqual(parsed);
    expect(partsIssues(parsed, hull)).toEqual([]);
  });

  it('fills the defaults the brief names', () => {
    const [ring, , , , , , mould] = partsSchema.parse({ longitudinals, parts: fixtures }).parts;
    expect(ring!.markedFace).toBe('auto');
    // common practice: a fillet clearance of 1 to 3 mm (REFERENCES.md); a mould has no fillet
    expect(ring!.filletClearanceMm).toBe(2);
    expect(mould!.filletClearanceMm).toBe(0);
    // common practice (REFERENCES.md, Plywood): 1220 x 2440 sheets
    expect(ring!.jointing.sheet).toEqual({ widthMm: 1220, lengthMm: 2440 });
    expect(ring!.bevelMarks.everyMm).toBe(50);
    // analytic: 45 degrees stored in radians
    expect(ring!.bevelMarks.sawTiltLimitRad).toBe(DEFAULT_SAW_TILT_LIMIT_RAD);
    expect(DEFAULT_SAW_TILT_LIMIT_RAD).toBeCloseTo(degToRad(45), 15);
    expect(ring!.marks).toEqual({ levelLineZ: null, setUpLineZ: null, grain: null });
    expect(ring!.layers[0]!.joints).toEqual({ by: 'count', pieces: 1 });
    const chine = longitudinalSchema.parse(longitudinals[0]);
    expect(chine.placement).toEqual({ by: 'line', lineId: 'chine', girthOffsetMm: 0 });
    expect([chine.sides, chine.against, chine.fromX, chine.toX]).toEqual(['both', 'skin', null, null]);
  });

  it('refuses a longitudinal or part id used twice', () => {
    const r = partsParse({ longitudinals: [longitudinals[0], longitudinals[0]], parts: [fixtures[0], fixtures[0]] });
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.issues.map((i) => i.field)).toEqual(['longitudinals.1.id', 'parts.1.id']);
      expect(r.issues[1]!.message).toBe('part "Frame 3" (f3): part id "f3" is used twice');
    }
  });
});

describe('part validation messages name the part, the field and the value', () => {
  it('a fillet clearance as wide as the ring', () => {
    const bad = { ...fixtures[0]!, filletClearanceMm: 55 };
    expect(messages(bad)).toEqual(['part "Frame 3" (f3): the fillet clearance of 55 mm is not less than the ring width (underDeckMm) of 50 mm']);
    const r = partsParse({ parts: [bad] });
    expect(!r.ok && r.issues[0]!.field).toBe('parts.0.filletClearanceMm');
    expect(!r.ok && r.issues[0]!.value).toBe(55);
  });

  it('a negative thickness', () => {
    expect(messages({ ...fixtures[1]!, layers: [{ thicknessMm: -4 }, { thicknessMm: 9 }] })).toContain(
      'part "Bulkhead 5" (b5): layers.0.thicknessMm: the layer thickness must be more than 0 mm, found -4 mm',
    );
    expect(messages({ ...fixtures[1]!, thicknessMm: -18 })[0]).toBe('part "Bulkhead 5" (b5): thicknessMm: the frame thickness must be more than 0 mm, found -18 mm');
  });

  it('a layer thicker than the frame, layers not adding up, and no layers', () => {
    expect(messages({ ...fixtures[1]!, layers: [{ thicknessMm: 24 }] })).toEqual([
      'part "Bulkhead 5" (b5): layer 1 is 24 mm thick, more than the frame\'s 18 mm',
      'part "Bulkhead 5" (b5): the layers add up to 24 mm but the frame is 18 mm thick',
    ]);
    expect(messages({ ...fixtures[1]!, layers: [] })).toEqual(['part "Bulkhead 5" (b5): has no layers; give at least one ply layer']);
  });

  it('joints out of order, a bevel reading on the wrong side of square, a rake past 80 degrees', () => {
    expect(messages({ ...fixtures[0]!, layers: [{ thicknessMm: 18, joints: { by: 'girth', girthsMm: [300, -200] } }] })).toEqual([
      "part \"Frame 3\" (f3): layer 1's joints must run in order of girth without repeats: -200 mm comes after 300 mm",
    ]);
    const measured = fixtures[8] as Extract<PartInput, { kind: 'measured-frame' }>;
    const wrong = { ...measured, measurement: { ...measured.measurement, points: [{ y: 0, h: 0, bevel: { readingRad: degToRad(100), sense: 'under' } }] } };
    expect(messages(wrong)).toEqual(["part \"Frame 8 as built\" (mf): point 1's sliding bevel reads 100 degrees, which is more than 90 for an under bevel"]);
    expect(messages({ ...fixtures[7]!, rakeRad: degToRad(85) })[0]).toMatch(/^part "Transom" \(tr\): rakeRad: the transom rake must be less than 80 degrees/);
  });

  it('partIssues says nothing of a consistent part, and the layers must add up whatever they are', () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 1, max: 40 }), { minLength: 1, maxLength: 5 }), (ts) => {
        const total = ts.reduce((a, b) => a + b, 0);
        const layers = ts.map((thicknessMm) => ({ thicknessMm }));
        // analytic: the layers sum to the frame, or they do not
        expect(partSchema.safeParse({ ...fixtures[1]!, thicknessMm: total, layers }).success).toBe(true);
        const off = partSchema.safeParse({ ...fixtures[1]!, thicknessMm: total + 1, layers });
        expect(off.success).toBe(false);
        expect(partIssues(partSchema.parse({ ...fixtures[1]!, thicknessMm: total, layers }))).toEqual([]);
      }),
    );
  });
});

describe('partsIssues', () => {
  it('finds references the hull does not have', () => {
    const parts = partsSchema.parse({
      longitudinals: [{ ...longitudinals[0]!, placement: { by: 'line', lineId: 'wl1' } }, longitudinals[4]!, { ...longitudinals[2]!, id: 'notcarlin' }],
      parts: [
        { ...fixtures[0]!, stationId: 's99', longitudinalIds: ['chine', 'nope'] },
        { ...fixtures[5]!, inboardEnd: { by: 'carlin', carlinId: 'notcarlin' } },
        { ...fixtures[6]!, carriesIds: ['rib9'] },
      ],
    });
    const issues = partsIssues(parts, hull);
    expect(issues.map((i) => [i.code, i.field])).toEqual([
      ['longitudinal-line', 'longitudinals.0.placement.lineId'],
      ['part-station', 'parts.0.stationId'],
      ['part-longitudinal', 'parts.0.longitudinalIds.1'],
      ['half-beam-carlin', 'parts.1.inboardEnd.carlinId'],
      ['part-longitudinal', 'parts.2.carriesIds.0'],
    ]);
    expect(issues[0]!.message).toBe('longitudinal "Chine log" (chine) is placed by line "wl1": a waterline, not a point line');
    expect(issues[1]!.message).toBe('part "Frame 3" (f3): station "s99" is not a station of the hull');
    expect(issues[3]!.message).toBe('part "Half beam 7" (hb7): "Hog" is a hog, not a carlin');
  });
});
