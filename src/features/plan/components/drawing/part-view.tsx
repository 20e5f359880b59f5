import { useEffect, useMemo, useState } from 'react';
import { Group, Line } from 'react-konva';
import { Ruler } from 'lucide-react';
import type { BuiltHull } from '../../../../../shared/geometry/hull';
import type { Notation } from '../../../../../shared/geometry/notation-schema';
import type { Plan } from '../../../../../shared/geometry/plan-schema';
import { Alert } from '../../../../components/ui/alert';
import { Button } from '../../../../components/ui/button';
import { SelectField } from '../../../../components/ui/field';
import { partComputeCache } from '../../drawing/part-compute';
import { labelsThinned, partShapes, type PartShapes, type PartStyle } from '../../drawing/part-shapes';
import { screenPoints } from '../../drawing/screen-points';
import { toScreen, type Viewport } from '../../drawing/viewport';
import { partKindLabels } from '../../editor/part-defaults';
import { lengthWords } from '../../format';
import { DrawingStage } from './drawing-stage';
import { KonvaLabel } from './konva-label';
import { EmptyNote } from '../../../../components/ui/empty-note';

export interface PartViewProps {
  plan: Plan;
  hull: BuiltHull;
  readOnly: boolean;
  notation: Notation;
  /** The part shown first (else the plan's first part). */
  partId?: string;
}

/** Stroke (px on screen, whatever the zoom), colour, dash and fill of each style; colours from the app's palette. */
const STYLES: Record<PartStyle, { stroke?: string; width: number; dash?: number[]; fill?: string }> = {
  'cut-edge': { stroke: '#1a2329', width: 3 },
  'layer-edge': { stroke: '#5f6a72', width: 1.5, dash: [2, 3] },
  'inner-edge': { stroke: '#1a2329', width: 2.5 },
  'other-face': { stroke: '#0e5466', width: 2, dash: [10, 6] },
  moulded: { stroke: '#4a5660', width: 1.5 },
  // The bands are a few mm wide: their own stroke keeps them visible as a coloured edge when zoomed out.
  'skin-band': { stroke: 'rgba(95, 106, 114, 0.55)', width: 6, fill: 'rgba(95, 106, 114, 0.35)' },
  'fillet-band': { stroke: 'rgba(230, 160, 40, 0.95)', width: 3, fill: 'rgba(242, 184, 75, 0.85)' },
  'deck-top': { stroke: '#6b4a00', width: 2 },
  centreline: { stroke: '#1d4ed8', width: 1.5, dash: [18, 5, 4, 5] },
  'level-line': { stroke: '#1f6b3a', width: 2 },
  waterline: { stroke: '#0e5466', width: 1.5, dash: [12, 6] },
  'set-up-line': { stroke: '#7d1a14', width: 2, dash: [4, 4] },
  grain: { stroke: '#5f6a72', width: 1.5 },
  limber: { stroke: '#1a2329', width: 1, dash: [3, 3] },
  dimension: { stroke: '#1a2329', width: 1 },
};

const LEGEND: { style: PartStyle; words: string }[] = [
  { style: 'cut-edge', words: 'Cut edge of the layer' },
  { style: 'other-face', words: 'Other face (dashed)' },
  { style: 'inner-edge', words: 'Inner edge, openings' },
  { style: 'layer-edge', words: 'Other layers' },
  { style: 'moulded', words: 'Moulded section' },
  { style: 'skin-band', words: 'Skin deducted' },
  { style: 'fillet-band', words: 'Fillet clearance' },
  { style: 'deck-top', words: 'Deck top and camber' },
  { style: 'level-line', words: 'Level line' },
  { style: 'waterline', words: 'Design waterline' },
  { style: 'set-up-line', words: 'Set-up line' },
  { style: 'centreline', words: 'Centreline' },
];

/** Bevel readings closer than this on screen are thinned out (a reading past the saw's limit always shows). */
const BEVEL_LABEL_GAP_PX = 56;
const TICK_PX = 16;
const CENTRE_LABEL_GAP_PX = 120;

function PartCanvas({ shapes, view }: { shapes: PartShapes; view: Viewport }) {
  const shownBevels = labelsThinned(shapes.bevels, (b) => toScreen(view, b.at), BEVEL_LABEL_GAP_PX, (b) => b.overLimit);
  const shown = new Set(shownBevels.map((b) => b.markNo));
  // Two limbers or notches side by side near the keel: one name is enough until the drawing is zoomed in.
  const named = new Set(labelsThinned(shapes.centres, (c) => toScreen(view, c.at), CENTRE_LABEL_GAP_PX));
  return (
    <Group listening={false}>
      {shapes.polylines.map((p, i) => {
        const s = STYLES[p.style];
        return <Line key={i} points={screenPoints(view, p.points)} closed={p.closed} stroke={s.stroke} strokeWidth={s.width} dash={s.dash} fill={s.fill} lineJoin="round" strokeEnabled={!!s.stroke} />;
      })}
      {shapes.centres.map((c, i) => {
        const s = toScreen(view, c.at);
        return (
          <Group key={`c${i}`}>
            <Line points={[s.x - 7, s.y, s.x + 7, s.y]} stroke="#1a2329" strokeWidth={1.5} />
            <Line points={[s.x, s.y - 7, s.x, s.y + 7]} stroke="#1a2329" strokeWidth={1.5} />
            {/* Outward of the mark, away from the centreline, so the name sits off the part and its bevel readings. */}
            {named.has(c) && <KonvaLabel x={c.at.x < 0 ? s.x - 9 : s.x + 9} y={s.y - 22} text={c.label} size={13} colour="#4a5660" align={c.at.x < 0 ? 'end' : 'start'} />}
          </Group>
        );
      })}
      {shapes.bevels.map((b) => {
        const s = toScreen(view, b.at);
        // Screen y runs down: the inward direction's vertical part flips.
        const dx = b.inward.x;
        const dy = -b.inward.y;
        const colour = b.overLimit ? '#a1231b' : '#1a2329';
        const labelled = shown.has(b.markNo);
        const tick = labelled ? TICK_PX : TICK_PX / 2;
        return (
          <Group key={`b${b.markNo}`}>
            <Line points={[s.x, s.y, s.x + dx * tick, s.y + dy * tick]} stroke={colour} strokeWidth={b.overLimit ? 3 : 1.5} />
            {labelled && <KonvaLabel x={s.x + dx * (tick + 4)} y={s.y + dy * (tick + 4)} text={b.text} size={b.overLimit ? 14 : 13} colour={colour} bold={b.overLimit} align={dx >= 0 ? 'start' : 'end'} middle />}
          </Group>
        );
      })}
      {shapes.labels.map((l, i) => {
        const s = toScreen(view, l.at);
        return <KonvaLabel key={`l${i}`} x={s.x} y={s.y} text={l.text} size={l.style === 'dimension' ? 15 : 14} colour={l.style === 'dimension' ? '#1a2329' : '#4a5660'} bold={l.style === 'dimension'} align={l.align} rotationDeg={l.rotationDeg} middle />;
      })}
      <SideWords shapes={shapes} view={view} />
    </Group>
  );
}

/** "Port" and "Starboard" at the top corners of the part, so nobody cuts a mirror image. */
function SideWords({ shapes, view }: { shapes: PartShapes; view: Viewport }) {
  const b = shapes.bounds;
  const left = toScreen(view, { x: b.minX, y: b.maxY });
  const right = toScreen(view, { x: b.maxX, y: b.maxY });
  const [l, r] = shapes.starboardSign > 0 ? ['Port', 'Starboard'] : ['Starboard', 'Port'];
  return (
    <>
      <KonvaLabel x={left.x} y={left.y - 28} text={l} size={16} colour="#1a2329" bold />
      <KonvaLabel x={right.x} y={right.y - 28} text={r} size={16} colour="#1a2329" bold align="end" />
    </>
  );
}

function Legend() {
  return (
    <ul aria-label="What the lines are" className="flex flex-wrap gap-x-5 gap-y-1 text-sm">
      {LEGEND.map(({ style, words }) => {
        const s = STYLES[style];
        return (
          <li key={style} className="flex items-center gap-2">
            <svg aria-hidden="true" width="32" height="12" className="shrink-0">
              {s.fill ? <rect x="0" y="1" width="32" height="10" fill={s.stroke ?? s.fill} /> : <line x1="0" y1="6" x2="32" y2="6" stroke={s.stroke} strokeWidth={s.width} strokeDasharray={s.dash?.join(' ')} />}
            </svg>
            {words}
          </li>
        );
      })}
    </ul>
  );
}

/**
 * One part at a time, worked out from the working copy as it changes: every layer's edge, the other face,
 * the inner edge, the skin and fillet clearance taken off the moulded section, deck and camber, notches,
 * limbers, reference lines and bevel marks, and its dimensions on demand.
 */
export function PartView({ plan, hull, notation, partId }: PartViewProps) {
  const parts = plan.parts.parts;
  const [chosenId, setChosenId] = useState<string | null>(partId ?? parts[0]?.id ?? null);
  useEffect(() => {
    if (partId) setChosenId(partId);
  }, [partId]);
  const part = parts.find((p) => p.id === chosenId) ?? parts[0] ?? null;
  const [layerIndex, setLayerIndex] = useState(0);
  const [dimensions, setDimensions] = useState(false);
  // One cache for the life of the view: a part whose input did not change comes back without computing.
  const [compute] = useState(partComputeCache);
  const longitudinals = plan.parts.longitudinals;
  const computed = useMemo(() => (part ? compute(hull, part, longitudinals) : null), [compute, hull, part, longitudinals]);
  const geometry = computed?.result.ok ? computed.result.part : null;
  const layer = geometry ? Math.min(layerIndex, geometry.layers.length - 1) : 0;
  const shapes = useMemo(
    () => (geometry ? partShapes(geometry, computed!.hullEdges, { layerIndex: layer, dimensions, lengthText: (mm) => lengthWords(mm, notation) }) : null),
    [geometry, computed, layer, dimensions, notation],
  );

  if (!part) return <EmptyNote>This hull has no parts yet. Add one on the Frames screen.</EmptyNote>;

  return (
    <section aria-labelledby="part-view-heading" className="flex flex-col gap-3">
      <h3 id="part-view-heading" className="sr-only">Part view</h3>
      <div className="flex flex-wrap items-end gap-4">
        <div className="min-w-64">
          <SelectField label="Part" value={part.id} onChange={(e) => setChosenId(e.target.value)}>
            {parts.map((p) => (
              <option key={p.id} value={p.id}>
                {p.name} ({partKindLabels[p.kind].toLowerCase()})
              </option>
            ))}
          </SelectField>
        </div>
        {geometry && geometry.layers.length > 1 && (
          <div className="min-w-56">
            <SelectField label="Layer" value={String(layer)} onChange={(e) => setLayerIndex(Number(e.target.value))}>
              {geometry.layers.map((l) => (
                <option key={l.index} value={l.index}>
                  Layer {l.index + 1} of {geometry.layers.length}, {l.thicknessMm} mm{l.index === 0 ? ' (marked face)' : ''}
                </option>
              ))}
            </SelectField>
          </div>
        )}
      </div>
      {computed && !computed.result.ok && (
        <Alert tone="error" title={`${part.name} cannot be drawn yet`}>
          <ul className="list-disc pl-6">
            {computed.result.issues.map((issue, i) => (
              <li key={`${issue.code}-${i}`}>{issue.message}</li>
            ))}
          </ul>
        </Alert>
      )}
      {geometry && shapes && (
        <>
          {shapes.overLimit.count > 0 && (
            <Alert tone="error" title={`Bevel past the saw's limit: ${shapes.overLimit.count} mark${shapes.overLimit.count === 1 ? '' : 's'}`}>
              The saw tilt reaches {shapes.overLimit.maxDeg.toFixed(1)}°, past the {shapes.overLimit.limitDeg.toFixed(1)}° limit set for this part. Those marks are drawn in red: cut that stretch square and plane the bevel by hand, or fit it another way.
            </Alert>
          )}
          {shapes.notDrawn > 0 && (
            <Alert tone="error" title="Part of the drawing is missing">
              {shapes.notDrawn} line{shapes.notDrawn === 1 ? '' : 's'} or mark{shapes.notDrawn === 1 ? '' : 's'} of {part.name} came out with a position that is not a number and {shapes.notDrawn === 1 ? 'is' : 'are'} not drawn. Do not cut from this drawing; please report it with the plan.
            </Alert>
          )}
          <p className="text-base">
            <span className="font-semibold">{geometry.marks.faceLabel}</span> (marked face). {shapes.viewWords}
          </p>
          <DrawingStage
            // Another part is another drawing: it opens fitted, whatever the last one was zoomed to.
            key={part.id}
            bounds={shapes.bounds}
            notation={notation}
            label={`Part view of ${part.name}`}
            toolbarExtra={
              <Button variant={dimensions ? 'primary' : 'secondary'} aria-pressed={dimensions} onClick={() => setDimensions((d) => !d)}>
                <Ruler aria-hidden="true" className="size-5" />
                Dimensions
              </Button>
            }
          >
            {(view) => <PartCanvas shapes={shapes} view={view} />}
          </DrawingStage>
          <Legend />
          {geometry.warnings.length > 0 && (
            <Alert tone="caution" title="Notes on this part">
              <ul className="list-disc pl-6">
                {geometry.warnings.map((w, i) => (
                  <li key={`${w.code}-${i}`}>{w.message}</li>
                ))}
              </ul>
            </Alert>
          )}
        </>
      )}
    </section>
  );
}
