import { z } from 'zod';
import { DEFAULT_FILLET_CLEARANCE_MM, DEFAULT_SAW_TILT_LIMIT_RAD, partSchema, type Part, type PartInput } from '../../../../../shared/geometry/part-schema';
import { degToRad, radToDeg } from '../../../../../shared/geometry/types';
import type { AddableKind } from '../../editor/part-defaults';

/**
 * The frames form as plain text fields, shaped like the part itself (so the shared schema's messages land
 * under the right field), and the two ways between it and a part. Lengths are millimetres, angles are
 * typed in degrees and stored in radians.
 */

export interface LayerValues {
  thicknessMm: string;
  pieces: string;
  material: 'plywood' | 'timber';
}
export interface LimberValues {
  girthMm: string;
  radiusMm: string;
  sides: 'both' | 'port' | 'starboard';
}
export interface OpeningValues {
  shape: 'circle' | 'rectangle' | 'slot';
  y: string;
  z: string;
  radiusMm: string;
  widthMm: string;
  heightMm: string;
  cornerRadiusMm: string;
  lengthMm: string;
  angleDeg: string;
  mirror: boolean;
}

export interface PartFormValues {
  name: string;
  kind: Part['kind'];
  stationId: string;
  markedFace: 'forward' | 'aft' | 'auto';
  thicknessMm: string;
  layers: LayerValues[];
  filletClearanceMm: string;
  ringWidth: { bottomMm: string; sidesMm: string; underDeckMm: string };
  innerCornerRadiusMm: string;
  top: 'deck' | 'open';
  topZ: string;
  mouldedDepthMm: string;
  hasTaper: boolean;
  taper: { endDepthMm: string; fromFraction: string };
  inboardEnd: { by: 'half-breadth' | 'carlin'; yMm: string; carlinId: string };
  sides: 'both' | 'port' | 'starboard';
  carriesIds: string[];
  rakeDeg: string;
  pivotZ: string;
  notchAll: boolean;
  longitudinalIds: string[];
  limbers: LimberValues[];
  openings: OpeningValues[];
  bevelMarks: { everyMm: string; sawTiltLimitDeg: string };
}

const text = (n: number | null | undefined): string => (n === null || n === undefined ? '' : String(Number(n.toFixed(4))));
const degText = (rad: number): string => String(Number(radToDeg(rad).toFixed(2)));

export const emptyOpening: OpeningValues = { shape: 'circle', y: '0', z: '', radiusMm: '50', widthMm: '', heightMm: '', cornerRadiusMm: '0', lengthMm: '', angleDeg: '0', mirror: false };

/** The form's values for a part, with every kind's fields filled (so switching kind shows sensible starting values). */
export function partToForm(part: Part): PartFormValues {
  const k = part as Partial<Record<string, unknown>> & Part;
  const ring = part.kind === 'ring-frame' ? part : null;
  const beam = part.kind === 'deck-beam' || part.kind === 'half-beam' ? part : null;
  const half = part.kind === 'half-beam' ? part : null;
  return {
    name: part.name,
    kind: part.kind,
    stationId: 'stationId' in part ? part.stationId : '',
    markedFace: part.markedFace,
    thicknessMm: text(part.thicknessMm),
    layers: part.layers.map((l) => ({ thicknessMm: text(l.thicknessMm), pieces: String(l.joints.by === 'count' ? l.joints.pieces : l.joints.girthsMm.length + 1), material: l.material })),
    filletClearanceMm: text(part.filletClearanceMm),
    ringWidth: { bottomMm: text(ring?.ringWidth.bottomMm ?? 75), sidesMm: text(ring?.ringWidth.sidesMm ?? 50), underDeckMm: text(ring?.ringWidth.underDeckMm ?? null) },
    innerCornerRadiusMm: text(ring?.innerCornerRadiusMm ?? 25),
    top: ring?.top ?? 'deck',
    topZ: text(typeof k.topZ === 'number' ? k.topZ : 300),
    mouldedDepthMm: text(beam?.mouldedDepthMm ?? 40),
    hasTaper: !!beam?.taper,
    taper: { endDepthMm: text(beam?.taper?.endDepthMm ?? 25), fromFraction: text(beam?.taper?.fromFraction ?? 0.5) },
    inboardEnd: {
      by: half?.inboardEnd.by ?? 'half-breadth',
      yMm: text(half?.inboardEnd.by === 'half-breadth' ? half.inboardEnd.yMm : 300),
      carlinId: half?.inboardEnd.by === 'carlin' ? half.inboardEnd.carlinId : '',
    },
    sides: half?.sides ?? 'both',
    carriesIds: part.kind === 'mould' ? [...part.carriesIds] : [],
    rakeDeg: part.kind === 'transom' ? degText(part.rakeRad) : '0',
    pivotZ: text(part.kind === 'transom' ? part.pivotZ : 0),
    notchAll: part.longitudinalIds === null,
    longitudinalIds: [...(part.longitudinalIds ?? [])],
    limbers: part.limbers.map((l) => ({ girthMm: text(l.girthMm), radiusMm: text(l.radiusMm), sides: l.sides })),
    openings: part.openings.map((o) => ({
      ...emptyOpening,
      shape: o.shape,
      y: text(o.y),
      z: text(o.z),
      mirror: o.mirror,
      ...(o.shape === 'circle' ? { radiusMm: text(o.radiusMm) } : {}),
      ...(o.shape === 'rectangle' ? { widthMm: text(o.widthMm), heightMm: text(o.heightMm), cornerRadiusMm: text(o.cornerRadiusMm) } : {}),
      ...(o.shape === 'slot' ? { lengthMm: text(o.lengthMm), widthMm: text(o.widthMm), angleDeg: degText(o.angleRad) } : {}),
    })),
    bevelMarks: { everyMm: text(part.bevelMarks.everyMm), sawTiltLimitDeg: degText(part.bevelMarks.sawTiltLimitRad) },
  };
}

type Ctx = z.RefinementCtx;

/** A group of checkboxes gives an array, but a group of one gives its value or false: always a list here. */
function asIds(value: unknown): string[] {
  if (Array.isArray(value)) return value.filter((v): v is string => typeof v === 'string');
  return typeof value === 'string' && value ? [value] : [];
}

/** A number typed into `path`; an issue there (naming the field) when it is not one. */
function num(ctx: Ctx, path: (string | number)[], value: string, what: string, optional = false): number | null {
  const t = value.trim().replace(',', '.');
  if (t === '') {
    if (!optional) ctx.addIssue({ code: 'custom', path, message: `Enter ${what}` });
    return null;
  }
  const n = Number(t);
  if (!Number.isFinite(n)) {
    ctx.addIssue({ code: 'custom', path, message: `${what} must be a number, found "${value.trim()}"` });
    return null;
  }
  return n;
}

/**
 * The form schema: text fields to a part (`previous` gives what the form does not edit: the id, the
 * jointing, marks and fillet, a measured frame's points), then the shared `partSchema`, whose checks
 * across fields (layers adding up, clearance against ring width) say what is wrong.
 */
export function partFormSchema(previous: Part) {
  return z
    .custom<PartFormValues>()
    .transform((v, ctx): PartInput => {
      const n = (path: (string | number)[], value: string, what: string) => num(ctx, path, value, what) ?? 0;
      const optional = (path: (string | number)[], value: string, what: string) => num(ctx, path, value, what, true);
      const deg = (path: (string | number)[], value: string, what: string) => degToRad(n(path, value, what));
      const common = {
        id: previous.id,
        name: v.name,
        markedFace: v.markedFace,
        thicknessMm: n(['thicknessMm'], v.thicknessMm, 'the frame thickness (mm)'),
        layers: v.layers.map((l, i) => ({
          thicknessMm: n(['layers', i, 'thicknessMm'], l.thicknessMm, `layer ${i + 1}'s thickness (mm)`),
          material: l.material,
          densityKgPerM3: previous.layers[i]?.densityKgPerM3 ?? null,
          joints: { by: 'count' as const, pieces: n(['layers', i, 'pieces'], l.pieces, `the number of pieces in layer ${i + 1}`) },
        })),
        filletClearanceMm: optional(['filletClearanceMm'], v.filletClearanceMm, 'the fillet clearance (mm)') ?? DEFAULT_FILLET_CLEARANCE_MM,
        jointing: previous.jointing,
        longitudinalIds: v.notchAll ? null : asIds(v.longitudinalIds),
        limbers: v.limbers.map((l, i) => ({ girthMm: n(['limbers', i, 'girthMm'], l.girthMm, 'the limber girth (mm)'), radiusMm: n(['limbers', i, 'radiusMm'], l.radiusMm, 'the limber radius (mm)'), sides: l.sides })),
        openings: v.openings.map((o, i) => {
          const at = (f: string) => ['openings', i, f];
          const centre = { y: n(at('y'), o.y, 'the opening centre across (y, mm)'), z: n(at('z'), o.z, 'the opening centre height (z, mm)'), mirror: o.mirror };
          if (o.shape === 'circle') return { shape: 'circle' as const, ...centre, radiusMm: n(at('radiusMm'), o.radiusMm, 'the opening radius (mm)') };
          if (o.shape === 'rectangle') {
            return { shape: 'rectangle' as const, ...centre, widthMm: n(at('widthMm'), o.widthMm, 'the opening width (mm)'), heightMm: n(at('heightMm'), o.heightMm, 'the opening height (mm)'), cornerRadiusMm: optional(at('cornerRadiusMm'), o.cornerRadiusMm, 'the corner radius (mm)') ?? 0 };
          }
          return { shape: 'slot' as const, ...centre, lengthMm: n(at('lengthMm'), o.lengthMm, 'the slot length (mm)'), widthMm: n(at('widthMm'), o.widthMm, 'the slot width (mm)'), angleRad: deg(at('angleDeg'), o.angleDeg, 'the slot angle (degrees)') };
        }),
        bevelMarks: {
          everyMm: n(['bevelMarks', 'everyMm'], v.bevelMarks.everyMm, 'the bevel mark spacing (mm)'),
          sawTiltLimitRad: optional(['bevelMarks', 'sawTiltLimitDeg'], v.bevelMarks.sawTiltLimitDeg, 'the saw tilt limit (degrees)') === null ? DEFAULT_SAW_TILT_LIMIT_RAD : deg(['bevelMarks', 'sawTiltLimitDeg'], v.bevelMarks.sawTiltLimitDeg, 'the saw tilt limit (degrees)'),
        },
        marks: previous.marks,
        fillet: previous.fillet,
      };
      if (!v.stationId && v.kind !== 'measured-frame') ctx.addIssue({ code: 'custom', path: ['stationId'], message: 'Choose the station the part stands at' });
      const stationed = { ...common, stationId: v.stationId };
      const taper = v.hasTaper ? { endDepthMm: n(['taper', 'endDepthMm'], v.taper.endDepthMm, 'the depth at the beam ends (mm)'), fromFraction: n(['taper', 'fromFraction'], v.taper.fromFraction, 'where the taper starts (0 to 1)') } : null;
      const kind = v.kind as AddableKind | 'measured-frame';
      switch (kind) {
        case 'ring-frame':
          return {
            ...stationed,
            kind,
            ringWidth: {
              bottomMm: n(['ringWidth', 'bottomMm'], v.ringWidth.bottomMm, 'the ring width at the bottom (mm)'),
              sidesMm: n(['ringWidth', 'sidesMm'], v.ringWidth.sidesMm, 'the ring width at the sides (mm)'),
              underDeckMm: optional(['ringWidth', 'underDeckMm'], v.ringWidth.underDeckMm, 'the ring width under the deck (mm)'),
            },
            innerCornerRadiusMm: n(['innerCornerRadiusMm'], v.innerCornerRadiusMm, 'the inner corner radius (mm)'),
            bottomToZ: previous.kind === 'ring-frame' ? previous.bottomToZ : null,
            top: v.top,
          };
        case 'bulkhead':
          return { ...stationed, kind };
        case 'partial-bulkhead':
        case 'floor':
          return { ...stationed, kind, topZ: n(['topZ'], v.topZ, 'the height of the top (mm above the baseline)') };
        case 'deck-beam':
          return { ...stationed, kind, mouldedDepthMm: n(['mouldedDepthMm'], v.mouldedDepthMm, 'the moulded depth (mm)'), taper };
        case 'half-beam':
          if (v.inboardEnd.by === 'carlin' && !v.inboardEnd.carlinId) ctx.addIssue({ code: 'custom', path: ['inboardEnd', 'carlinId'], message: 'Choose the carlin the half beam ends at' });
          return {
            ...stationed,
            kind,
            mouldedDepthMm: n(['mouldedDepthMm'], v.mouldedDepthMm, 'the moulded depth (mm)'),
            taper,
            inboardEnd: v.inboardEnd.by === 'carlin' ? { by: 'carlin', carlinId: v.inboardEnd.carlinId || 'none' } : { by: 'half-breadth', yMm: n(['inboardEnd', 'yMm'], v.inboardEnd.yMm, 'the half-breadth of the inboard end (mm)') },
            sides: v.sides,
          };
        case 'mould':
          return { ...stationed, kind, carriesIds: asIds(v.carriesIds) };
        case 'transom': {
          const rake = n(['rakeDeg'], v.rakeDeg, 'the rake (degrees from the vertical)');
          if (Math.abs(rake) >= 80) ctx.addIssue({ code: 'custom', path: ['rakeDeg'], message: `The rake must be less than 80 degrees from the vertical, found ${rake}` });
          return { ...stationed, kind, rakeRad: degToRad(rake), pivotZ: n(['pivotZ'], v.pivotZ, 'the height where the transom crosses the station (mm)') };
        }
        case 'measured-frame': {
          const measured = previous as Extract<Part, { kind: 'measured-frame' }>;
          return { ...common, kind, x: measured.x, measurement: measured.measurement, symmetry: measured.symmetry, measuredFace: measured.measuredFace };
        }
      }
    })
    .pipe(partSchema);
}

/** The form field that shows an issue of the shared schema (its path in the part), where they differ. */
export function formPathOf(path: readonly PropertyKey[]): string {
  const p = path.map(String);
  const joined = p.join('.');
  if (joined === 'rakeRad') return 'rakeDeg';
  if (joined === 'bevelMarks.sawTiltLimitRad') return 'bevelMarks.sawTiltLimitDeg';
  if (p[0] === 'layers' && p[2] === 'joints') return `layers.${p[1]}.pieces`;
  if (p[0] === 'openings' && p[2] === 'angleRad') return `openings.${p[1]}.angleDeg`;
  // "The layers add up to..." is about the layers as a whole.
  if (joined === 'layers') return 'layersTotal';
  return joined;
}
