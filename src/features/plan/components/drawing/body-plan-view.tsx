import { memo, useCallback, useEffect, useMemo, useRef, useState, type KeyboardEvent as ReactKeyboardEvent } from 'react';
import { flushSync } from 'react-dom';
import type Konva from 'konva';
import { Circle, Group, Line, Rect, RegularPolygon } from 'react-konva';
import { Grid3x3, Magnet } from 'lucide-react';
import type { BuiltHull } from '../../../../../shared/geometry/hull';
import type { HullLines, Line as HullLine } from '../../../../../shared/geometry/hull-schema';
import type { Plan } from '../../../../../shared/geometry/plan-schema';
import type { Notation } from '../../../../../shared/geometry/notation-schema';
import { lengthPrecisionStepMm } from '../../../../../shared/geometry/notation';
import type { Section } from '../../../../../shared/geometry/section';
import { Button } from '../../../../components/ui/button';
import { cellSet, type CellValue } from '../../editor/cell-actions';
import { offsetDelete, offsetFreedomOf, offsetMove, offsetPointOf, type OffsetFreedom, type SectionPlanePoint } from '../../editor/offset-actions';
import type { Edit } from '../../editor/types';
import { edit } from '../../editor/types';
import type { CellFlag } from '../../hooks/use-lines-check';
import {
  bodyPlanBounds,
  bodyPlanSides,
  drawingPointOf,
  OFFSET_MEASURE_WORDS,
  offsetHandlesAt,
  offsetHandlesByGirth,
  offsetNudge,
  offsetPointsOf,
  offsetSnap,
  referenceLinesOf,
  sectionPointOf,
  sidesOf,
  type BodyPlanSide,
  type OffsetHandle,
} from '../../drawing/body-plan';
import { DRAG_MEASURES } from '../../drawing/drag-measures';
import type { LivePartAsk } from '../../drawing/live-part.worker';
import { draggedPartOutlines, livePartCache, livePartDue, livePartOutlinesOf, outlinesHalfBreadth, partsAtStation, REST_MS, type LivePartOutline } from '../../drawing/live-part';
import { createSectionCache, stationSectionOf } from '../../drawing/station-section';
import { toHull, toScreen, type Point, type Viewport } from '../../drawing/viewport';
import { lengthWords, pointWords } from '../../format';
import { DrawingStage } from './drawing-stage';
import { KonvaLabel } from './konva-label';

/** The offset chosen on the drawing or in the side table. */
export interface OffsetSelection {
  stationId: string;
  lineId: string | null;
}

export interface BodyPlanViewProps {
  plan: Plan;
  /** The whole hull built from the plan's lines (sections are cut from it). */
  hull: BuiltHull;
  readOnly: boolean;
  notation: Notation;
  selection: OffsetSelection | null;
  onSelect: (selection: OffsetSelection) => void;
  /** Make one change of the plan (through the editor's store, so undo spans table and drawing). */
  onEdit: (edit: Edit) => void;
  /** Fairness flags by line id, then `stationId:field`. */
  cellFlags: Map<string, Map<string, CellFlag>>;
}

const INK = '#1a2329';
const FORWARD = '#0e5466';
const AFT = '#7d1a14';
const REFERENCE = '#8a949b';
const CAUTION = '#b7791f';
const KNUCKLE = '#6b4a00';
/** The part at the dragged station: a violet none of the section, reference or flag colours is near. */
const LIVE_PART = '#6b2fa3';
const LIVE_PART_WORDS = 'Part at this station (follows the drag)';
const HANDLE_RADIUS_PX = 9;
/** How near (screen px) another point must be to pull a dragged offset to it. */
const SNAP_PX = 8;
/** A pointer that moves less than this (px) between down and up chose a point; it did not drag it. */
const CLICK_SLOP_PX = 3;
/** Grid spacings offered (mm), the first the default: 10 mm, or about 1/2 in for an imperial hull. */
const GRID_MM = { mm: 10, in: 12.7, ftin: 12.7 } as const;
/** One arrow key's move of a chosen point without the grid (mm): 1 mm, or 1/16 in for an imperial hull. */
const KEY_STEP_MM = { mm: 1, in: 25.4 / 16, ftin: 25.4 / 16 } as const;
/** Steps a Shift+arrow moves a point. */
const SHIFT_STEPS = 10;
/** Arrow keys as directions on the drawing (x to the right, y up). */
const ARROWS: Record<string, Point> = { ArrowLeft: { x: -1, y: 0 }, ArrowRight: { x: 1, y: 0 }, ArrowUp: { x: 0, y: 1 }, ArrowDown: { x: 0, y: -1 } };
/** The ring round the point the keys act on: the app's focus colour on a white halo, as a focused control has. */
const FOCUS = '#0e5466';
const FOCUS_RING_PX = HANDLE_RADIUS_PX + 7;
const POINT_KEYS_READ_ONLY = 'N and P step through the chosen section\'s points and read them out; Escape lets go of the point.';
const POINT_KEYS = 'N and P step through the chosen section\'s points; the arrow keys then move the point, Shift ten steps at a time; Delete takes it out; Escape lets go of it.';
const FREEDOM_WORDS: Record<OffsetFreedom, string> = { across: 'across only', up: 'up and down only', along: 'along its diagonal only', free: 'anywhere this side of the centreline' };

/** An offset read out: "WL 300 at St 4: half-breadth 612 mm". */
function offsetWords(line: HullLine, stationName: string, value: CellValue | undefined, notation: Notation): string {
  const words = value == null ? 'no point' : typeof value === 'number' ? `${OFFSET_MEASURE_WORDS[line.kind]} ${lengthWords(value, notation)}` : pointWords(value, notation);
  return `${line.name} at ${stationName}: ${words}`;
}

/** The move one arrow key makes of a point (mm): the snap grid's spacing when it is on, else a small step no finer than the hull's precision. */
function keyStepMm(notation: Notation, grid: boolean, shift: boolean): number {
  const one = grid ? GRID_MM[notation.unit] : Math.max(KEY_STEP_MM[notation.unit], lengthPrecisionStepMm(notation));
  return shift ? one * SHIFT_STEPS : one;
}

/** A worker for the dragged part where the browser has them; null where it has not (the component tests' DOM). */
function startPartWorker(): Worker | null {
  if (typeof Worker === 'undefined') return null;
  try {
    return new Worker(new URL('../../drawing/live-part.worker.ts', import.meta.url), { type: 'module' });
  } catch {
    return null;
  }
}

const flat = (view: Viewport, pts: Point[]): number[] => pts.flatMap((p) => {
  const s = toScreen(view, p);
  return [s.x, s.y];
});

interface Drag {
  handle: OffsetHandle;
  side: 'forward' | 'aft';
  pointerId: number;
  /** The latest pointer position not yet drawn (client px), and when each move since the last frame came (ms). */
  pending: { clientX: number; clientY: number; moves: number[] } | null;
  frame: number;
  /** Where the pointer went down (client px), and whether it has since moved far enough to be a drag. */
  startX: number;
  startY: number;
  moved: boolean;
  /** Takes off the window listeners this drag put on. */
  detach: () => void;
  /** The offset as last drawn (mm, on its line's direction): what the part is worked out for. */
  at: SectionPlanePoint | null;
  /** When the pointer last moved (ms, performance clock). */
  lastMoveAt: number;
  /** The part's throttle (live-part.ts `livePartDue`): one computation pending, frames since the last, the rest timer. */
  partPending: boolean;
  partFrames: number;
  partTimer: ReturnType<typeof setTimeout> | undefined;
  /** The question last sent to the worker, and the offset it was for. */
  partAsked: { id: number; at: SectionPlanePoint } | null;
  /** The worker's latest answer, drawn with the next frame (one render and one layer draw, not two). */
  partAnswer: LivePartOutline[] | null;
}

interface Preview {
  stationId: string;
  lineId: string;
  value: CellValue;
  /** Where the offset is (mm): on its line's direction, snapped. */
  at: SectionPlanePoint;
  lines: HullLines;
  section: Section | null;
}

const cellOf = (line: HullLine, stationId: string): CellValue | undefined => (line.cells as Record<string, CellValue | undefined>)[stationId];

/** The section, unless a point of it is not a finite number (nothing is drawn at NaN). */
function drawable(section: Section | null): Section | null {
  return section && section.vertices.every((v) => Number.isFinite(v.y) && Number.isFinite(v.z)) ? section : null;
}

/** One station's section on its side (or both), drawn as one polyline a side. */
const SectionShape = memo(function SectionShape({
  view,
  section,
  side,
  selected,
  stationId,
  onPick,
}: {
  view: Viewport;
  section: Section;
  side: BodyPlanSide;
  selected: boolean;
  stationId: string;
  /** Choose this station; null where a click should do nothing. */
  onPick: ((stationId: string) => void) | null;
}) {
  return (
    <>
      {sidesOf(side).map((s) => (
        <Line
          key={s}
          points={flat(view, section.vertices.map((v) => drawingPointOf(v, s)))}
          stroke={selected ? INK : s === 'forward' ? FORWARD : AFT}
          strokeWidth={selected ? 3.5 : 1.5}
          hitStrokeWidth={10}
          lineJoin="round"
          listening={onPick !== null}
          onPointerClick={onPick ? () => onPick(stationId) : undefined}
          perfectDrawEnabled={false}
        />
      ))}
      {section.nodes
        .filter((n) => n.knuckle)
        .flatMap((n, i) =>
          sidesOf(side).map((s) => {
            const p = toScreen(view, drawingPointOf(n, s));
            return <Rect key={`${s}-${i}`} x={p.x - 4} y={p.y - 4} width={8} height={8} stroke={KNUCKLE} strokeWidth={2} listening={false} />;
          }),
        )}
    </>
  );
});

/** The point the keys act on, ringed as a focused control is: a white halo under the focus colour. */
function FocusRing({ at }: { at: Point }) {
  return (
    <>
      <Circle x={at.x} y={at.y} radius={FOCUS_RING_PX} stroke="#ffffff" strokeWidth={7} listening={false} />
      <Circle x={at.x} y={at.y} radius={FOCUS_RING_PX} stroke={FOCUS} strokeWidth={3} listening={false} />
    </>
  );
}

/**
 * The part's cut outline over the dragged station, outer edge solid and inner edge dashed, on the station's
 * side as its section is (a frame is symmetric, so the mirror for an aft station is the same part). Kept
 * apart (memo) so a section frame does not map its points again: they change only with a new answer.
 */
const LivePartShape = memo(function LivePartShape({ view, outlines, side }: { view: Viewport; outlines: readonly LivePartOutline[]; side: 'forward' | 'aft' }) {
  return (
    <>
      {outlines.map((o) => (
        <Group key={o.partId} listening={false}>
          {o.outer.map((loop, i) => (
            <Line key={`o${i}`} points={flat(view, loop.map((p) => drawingPointOf(p, side)))} closed stroke={LIVE_PART} strokeWidth={2.5} lineJoin="round" perfectDrawEnabled={false} />
          ))}
          {o.inner.map((loop, i) => (
            <Line key={`i${i}`} points={flat(view, loop.map((p) => drawingPointOf(p, side)))} closed stroke={LIVE_PART} strokeWidth={2} dash={[8, 4]} lineJoin="round" perfectDrawEnabled={false} />
          ))}
        </Group>
      ))}
    </>
  );
});

/**
 * The body plan: every station's section, forward ones right of the centreline and aft ones left, over
 * the waterlines, buttocks and diagonals; knuckles marked with squares and fairness flags with triangles.
 * The chosen station's offsets are handles: each is dragged along the one direction its cell allows, the
 * section following live (only that station is worked out again, at most once a frame), and one edit is
 * made when the drag ends. A part at the dragged station follows too: its cut outline, worked out from the
 * whole plan with the dragged value (in a worker where there is one), one computation at a time.
 */
export function BodyPlanView({ plan, hull, readOnly, notation, selection, onSelect, onEdit, cellFlags }: BodyPlanViewProps) {
  const lines = plan.lines;
  const stations = lines.stations;
  const cache = useRef(createSectionCache());
  const sides = useMemo(() => bodyPlanSides(lines), [lines]);
  const sections = useMemo(() => new Map(lines.stations.map((s) => [s.id, drawable(cache.current(lines, s.id, hull))])), [lines, hull]);
  // A station with offsets but no section to draw (beyond the hull's ends, or a point that is not a number) is said in words.
  const notDrawn = lines.stations.filter((s) => !sections.get(s.id) && lines.lines.some((l) => (l.cells as Record<string, unknown>)[s.id] != null));
  const bounds = useMemo(() => bodyPlanBounds(sections.values()) ?? { minX: -1000, minY: 0, maxX: 1000, maxY: 1000 }, [sections]);
  const references = useMemo(() => referenceLinesOf(lines, bounds), [lines, bounds]);
  const allPoints = useMemo(() => offsetPointsOf(lines), [lines]);
  const [snapGrid, setSnapGrid] = useState(false);
  const [snapPoints, setSnapPoints] = useState(true);
  const [preview, setPreview] = useState<Preview | null>(null);
  /** What the keys last did, read out politely (the chosen point and its value). */
  const [announcement, setAnnouncement] = useState('');
  const drag = useRef<Drag | null>(null);
  const viewRef = useRef<Viewport | null>(null);
  const groupRef = useRef<Konva.Group>(null);
  const stationId = selection?.stationId ?? null;
  // The part(s) at the chosen station: worked out here from the plan as it stands (its widest half-breadth is
  // reported on the element; the cache recomputes only when the part's input changes), and from the dragged
  // plan while a point of that station is dragged, in the worker (its own cache) or, without one, here.
  const [partCache] = useState(livePartCache);
  const [livePart, setLivePart] = useState<{ stationId: string; outlines: LivePartOutline[] } | null>(null);
  /** How long the last part computation of a drag took (ms): the throttle's measure of this hull. */
  const partCost = useRef<number | null>(null);
  const partWorker = useRef<Worker | null>(null);
  const partAskId = useRef(0);
  const restOutlines = useMemo(() => (stationId ? livePartOutlinesOf(hull, plan, stationId, partCache) : []), [hull, plan, stationId, partCache]);
  const stationHasParts = stationId !== null && partsAtStation(plan, stationId).length > 0;

  // What the drag handler reads without being made again on every render.
  const latest = useRef({ plan, notation, snapGrid, snapPoints, allPoints, onEdit, onSelect });
  latest.current = { plan, notation, snapGrid, snapPoints, allPoints, onEdit, onSelect };
  const pickStation = useCallback((id: string) => latest.current.onSelect({ stationId: id, lineId: null }), []);

  useEffect(() => () => endDrag(false), []);
  useEffect(() => {
    const w = startPartWorker();
    partWorker.current = w;
    if (!w) return undefined;
    w.onmessage = (event: MessageEvent<{ id: number; outlines: LivePartOutline[] | null }>) => {
      const d = drag.current;
      if (!d || d.partAsked?.id !== event.data.id) return;
      const asked = d.partAsked;
      d.partAsked = null;
      d.partPending = false;
      // Lines that build no hull draw no part (rather than the last one, which would no longer be true).
      d.partAnswer = event.data.outlines ?? [];
      if (!d.frame) d.frame = requestAnimationFrame(() => drawFrame(d));
      // The pointer moved on while this one was worked out and has stopped since: catch up now.
      if (d.at !== asked.at) partMaybe(d);
    };
    // A worker that fails leaves the part to the page's thread.
    w.onerror = () => {
      partWorker.current = null;
      const d = drag.current;
      if (d?.partPending) {
        d.partPending = false;
        d.partAsked = null;
        partMaybe(d);
      }
    };
    return () => {
      w.terminate();
      partWorker.current = null;
    };
    // Once for the view's life: the handlers read the drag through refs.
  }, []);

  function moveTo(d: Drag, clientX: number, clientY: number): Preview | null {
    const { plan: currentPlan, notation: n, snapGrid: grid, snapPoints: pts, allPoints: everyPoint } = latest.current;
    const view = viewRef.current;
    const stage = groupRef.current?.getStage();
    const line = currentPlan.lines.lines.find((l) => l.id === d.handle.lineId);
    if (!view || !stage || !line) return null;
    const box = stage.container().getBoundingClientRect();
    const to = sectionPointOf(toHull(view, { x: clientX - box.left, y: clientY - box.top }), d.side);
    const snapped = offsetSnap(line, to, {
      gridMm: grid ? GRID_MM[n.unit] : null,
      points: pts ? everyPoint.filter((p) => !(p.stationId === d.handle.stationId && p.lineId === d.handle.lineId)).map((p) => p.at) : [],
      toleranceMm: SNAP_PX / view.scale,
      stepMm: lengthPrecisionStepMm(n),
    });
    const previewLines = cellSet(currentPlan, { lineId: line.id, stationId: d.handle.stationId, value: snapped.value }).lines;
    return { stationId: d.handle.stationId, lineId: line.id, value: snapped.value, at: snapped.at, lines: previewLines, section: drawable(stationSectionOf(previewLines, d.handle.stationId, { trusted: true })) };
  }

  function onWindowMove(e: PointerEvent) {
    const d = drag.current;
    if (!d || e.pointerId !== d.pointerId) return;
    // A press that stays put is a click choosing the point: it must not nudge the value by a pixel.
    if (!d.moved && Math.hypot(e.clientX - d.startX, e.clientY - d.startY) < CLICK_SLOP_PX) return;
    d.moved = true;
    const started = performance.now();
    d.lastMoveAt = started;
    // The pointer may stop here: the part is worked out once it has rested (or sooner on a cheap hull).
    clearTimeout(d.partTimer);
    d.partTimer = setTimeout(() => partMaybe(d), REST_MS);
    d.pending = { clientX: e.clientX, clientY: e.clientY, moves: [...(d.pending?.moves ?? []), started] };
    // At most one section a frame: pointer events can come faster than the screen paints.
    if (!d.frame) d.frame = requestAnimationFrame(() => drawFrame(d));
    performance.measure(DRAG_MEASURES.handler, { start: started, end: performance.now() });
  }

  function drawFrame(d: Drag) {
    d.frame = 0;
    const p = d.pending;
    d.pending = null;
    if (drag.current !== d) return;
    const answer = d.partAnswer;
    d.partAnswer = null;
    const showAnswer = () => {
      if (answer) setLivePart({ stationId: d.handle.stationId, outlines: answer });
    };
    if (!p) {
      // No move to draw, only the worker's answer (the pointer is resting).
      if (answer) {
        flushSync(showAnswer);
        groupRef.current?.getLayer()?.draw();
      }
      return;
    }
    const began = performance.now();
    const next = moveTo(d, p.clientX, p.clientY);
    if (!next) return;
    d.at = next.at;
    flushSync(() => {
      setPreview(next);
      showAnswer();
    });
    // Draw now rather than at konva's next frame, so the point is under the pointer in this frame.
    groupRef.current?.getLayer()?.draw();
    const end = performance.now();
    performance.measure(DRAG_MEASURES.frame, { start: began, end });
    // Every move this frame answered, from its handler to the drawn frame (what the bench reports).
    for (const at of p.moves) performance.measure(DRAG_MEASURES.moveToPaint, { start: at, end });
    d.partFrames += 1;
    partMaybe(d);
  }

  /** Start the part's computation if the throttle allows it now: sent to the worker, or else run in its own task after this frame is painted. */
  function partMaybe(d: Drag) {
    if (drag.current !== d || !d.at || !partsAtStation(latest.current.plan, d.handle.stationId).length) return;
    const worker = partWorker.current;
    if (!livePartDue({ pending: d.partPending, offThread: worker !== null, framesSince: d.partFrames, lastCostMs: partCost.current, restedMs: performance.now() - d.lastMoveAt })) return;
    d.partPending = true;
    d.partFrames = 0;
    if (worker) {
      const at = d.at;
      const id = (partAskId.current += 1);
      d.partAsked = { id, at };
      // The plan with the dragged value in its cell: the same action, and so the same plan, the drag's edit makes when it ends.
      const dragged = offsetMove(latest.current.plan, { lineId: d.handle.lineId, stationId: d.handle.stationId, to: at });
      worker.postMessage({ id, plan: dragged, stationId: d.handle.stationId } satisfies LivePartAsk);
      return;
    }
    setTimeout(() => partRun(d), 0);
  }

  function partRun(d: Drag) {
    const at = d.at;
    if (drag.current !== d || !at) {
      d.partPending = false;
      return;
    }
    const began = performance.now();
    // As in the worker's question: the plan as the drag's edit will make it.
    const dragged = offsetMove(latest.current.plan, { lineId: d.handle.lineId, stationId: d.handle.stationId, to: at });
    const outlines = draggedPartOutlines(dragged, d.handle.stationId, partCache);
    partCost.current = performance.now() - began;
    d.partPending = false;
    // Lines that build no hull draw no part (rather than the last one, which would no longer be true).
    setLivePart({ stationId: d.handle.stationId, outlines: outlines ?? [] });
    // The pointer moved on while this one was worked out: catch up once it rests (the timer of its last move may have fired meanwhile).
    if (d.at !== at) {
      clearTimeout(d.partTimer);
      d.partTimer = setTimeout(() => partMaybe(d), Math.max(0, REST_MS - (performance.now() - d.lastMoveAt)));
    }
  }

  function onWindowUp(e: PointerEvent) {
    const d = drag.current;
    if (!d || e.pointerId !== d.pointerId) return;
    endDrag(true, e);
  }

  function onWindowKey(e: KeyboardEvent) {
    if (e.key === 'Escape' && drag.current) endDrag(false);
  }

  function endDrag(commit: boolean, e?: PointerEvent) {
    const d = drag.current;
    if (!d) return;
    cancelAnimationFrame(d.frame);
    clearTimeout(d.partTimer);
    drag.current = null;
    d.detach();
    const final = commit && e && d.moved ? moveTo(d, e.clientX, e.clientY) : null;
    setPreview(null);
    setLivePart(null);
    // The point as drawn last, already on its line's direction: the edit puts the same value in the cell.
    if (final) commitMove(final.lineId, final.stationId, final.at);
  }

  /** One undoable edit moving an offset to `at` (mm, on its line's direction): the end of a drag, or one arrow key. */
  function commitMove(lineId: string, stationId: string, at: SectionPlanePoint) {
    const { plan: current, onEdit: apply } = latest.current;
    const line = current.lines.lines.find((l) => l.id === lineId);
    const station = current.lines.stations.find((s) => s.id === stationId);
    if (line && station) apply(edit(`Move ${line.name} at ${station.name}`, offsetMove, { lineId: line.id, stationId: station.id, to: at }));
  }

  function startDrag(handle: OffsetHandle, side: 'forward' | 'aft', e: Konva.KonvaEventObject<PointerEvent>) {
    if (readOnly || e.evt.button !== 0) return;
    e.cancelBubble = true;
    endDrag(false);
    for (const name of Object.values(DRAG_MEASURES)) performance.clearMeasures(name);
    // The listeners of this render, kept with the drag so the same ones come off when it ends.
    const move = onWindowMove;
    const up = onWindowUp;
    const key = onWindowKey;
    window.addEventListener('pointermove', move);
    window.addEventListener('pointerup', up);
    window.addEventListener('pointercancel', up);
    window.addEventListener('keydown', key);
    const detach = () => {
      window.removeEventListener('pointermove', move);
      window.removeEventListener('pointerup', up);
      window.removeEventListener('pointercancel', up);
      window.removeEventListener('keydown', key);
    };
    drag.current = { handle, side, pointerId: e.evt.pointerId, pending: null, frame: 0, startX: e.evt.clientX, startY: e.evt.clientY, moved: false, detach, at: null, lastMoveAt: performance.now(), partPending: false, partFrames: Infinity, partTimer: undefined, partAsked: null, partAnswer: null };
    latest.current.onSelect({ stationId: handle.stationId, lineId: handle.lineId });
  }

  const shownLines = preview?.lines ?? lines;
  const handles = stationId ? offsetHandlesAt(shownLines, stationId) : [];
  const handleSide: 'forward' | 'aft' = stationId && sides.get(stationId) === 'aft' ? 'aft' : 'forward';
  const flags = useMemo(() => {
    const out: { key: string; at: Point; words: string }[] = [];
    for (const [lineId, byCell] of cellFlags) {
      const line = lines.lines.find((l) => l.id === lineId);
      if (!line) continue;
      for (const [key, flag] of byCell) {
        const at = key.lastIndexOf(':');
        const sid = key.slice(0, at);
        const p = offsetPointOf(line, cellOf(line, sid));
        const side = sides.get(sid);
        if (!p || !side) continue;
        for (const s of sidesOf(side)) out.push({ key: `${lineId}:${key}:${s}`, at: drawingPointOf(p, s), words: flag.message });
      }
    }
    return out;
  }, [cellFlags, lines, sides]);

  // Left of the centreline is the aft sections' side: a half-breadth is never negative.
  const pointerWords = useCallback(
    (p: Point) => `Half-breadth ${lengthWords(Math.abs(p.x), notation)} ${p.x < 0 ? '(aft side)' : '(forward side)'} · Height ${lengthWords(p.y, notation)}`,
    [notation],
  );

  const toolbarExtra = readOnly ? null : (
    <>
      <Button variant={snapGrid ? 'primary' : 'secondary'} aria-pressed={snapGrid} onClick={() => setSnapGrid((v) => !v)} title="Dragged points land on a grid">
        <Grid3x3 aria-hidden="true" className="size-5" />
        Snap to grid
      </Button>
      <Button variant={snapPoints ? 'primary' : 'secondary'} aria-pressed={snapPoints} onClick={() => setSnapPoints((v) => !v)} title="Dragged points line up with other points nearby">
        <Magnet aria-hidden="true" className="size-5" />
        Snap to points
      </Button>
    </>
  );

  // The drawing's own keys (the stage asks these first): N and P step through the chosen station's points in
  // girth order; with a point chosen the arrows move it along its line's direction (Shift ten steps), Delete
  // takes it out and Escape lets go of it, so the arrows move the drawing again. A reader only steps and hears.
  const onViewKey = (e: ReactKeyboardEvent<HTMLDivElement>): boolean => {
    // During a drag the pointer has the point (Escape cancels the drag through the window's listener).
    if (drag.current) return false;
    const station = lines.stations.find((s) => s.id === stationId);
    if (!station) return false;
    const key = e.key.length === 1 ? e.key.toLowerCase() : e.key;
    const chosenLine = lines.lines.find((l) => l.id === selection?.lineId);
    if (key === 'n' || key === 'p') {
      const inOrder = offsetHandlesByGirth(offsetHandlesAt(lines, station.id), sections.get(station.id) ?? null);
      if (inOrder.length === 0) {
        setAnnouncement(`${station.name} has no points to step through.`);
        return true;
      }
      const at = inOrder.findIndex((h) => h.lineId === chosenLine?.id);
      const next = at < 0 ? (key === 'n' ? 0 : inOrder.length - 1) : (at + (key === 'n' ? 1 : -1) + inOrder.length) % inOrder.length;
      const handle = inOrder[next]!;
      const line = lines.lines.find((l) => l.id === handle.lineId)!;
      onSelect({ stationId: station.id, lineId: line.id });
      setAnnouncement(`${offsetWords(line, station.name, cellOf(line, station.id), notation)}. Point ${next + 1} of ${inOrder.length}.`);
      return true;
    }
    if (key === 'Escape') {
      if (chosenLine) {
        onSelect({ stationId: station.id, lineId: null });
        setAnnouncement('No point chosen: the arrow keys move the drawing.');
      }
      // Not taken: the stage clears a measurement with it too.
      return false;
    }
    if (readOnly || !chosenLine) return false;
    if (key === 'Delete' || key === 'Backspace') {
      onEdit(edit(`Delete ${chosenLine.name} at ${station.name}`, offsetDelete, { lineId: chosenLine.id, stationId: station.id }));
      onSelect({ stationId: station.id, lineId: null });
      setAnnouncement(`${chosenLine.name} at ${station.name} taken out.`);
      return true;
    }
    const arrow = ARROWS[key];
    const from = offsetPointOf(chosenLine, cellOf(chosenLine, station.id));
    // An arrow with no point there (a chosen empty cell) moves the drawing.
    if (!arrow || !from) return false;
    const moved = offsetNudge(chosenLine, from, sectionPointOf(arrow, handleSide), keyStepMm(notation, snapGrid, e.shiftKey));
    if (Math.hypot(moved.at.y - from.y, moved.at.z - from.z) < 1e-9) {
      setAnnouncement(`${offsetWords(chosenLine, station.name, cellOf(chosenLine, station.id), notation)}; it moves ${FREEDOM_WORDS[offsetFreedomOf(chosenLine)]}.`);
      return true;
    }
    commitMove(chosenLine.id, station.id, moved.at);
    setAnnouncement(offsetWords(chosenLine, station.name, moved.value, notation));
    return true;
  };

  const draggingId = preview?.stationId ?? null;
  // Everything but the chosen station's handles and a dragged section: made again only when the view,
  // the plan or the choice changes, so a drag frame redraws the overlay alone.
  const drawStatic = useCallback(
    (view: Viewport) => {
      viewRef.current = view;
      return (
        <>
          <Line points={flat(view, [{ x: 0, y: bounds.minY }, { x: 0, y: bounds.maxY }])} stroke={INK} strokeWidth={1.5} dash={[16, 4, 4, 4]} listening={false} />
          {references.map((r) => (
            <Group key={r.lineId} listening={false}>
              {r.pieces.map(([a, b], i) => (
                <Line key={i} points={flat(view, [a, b])} stroke={REFERENCE} strokeWidth={1} dash={r.kind === 'diagonal' ? [10, 4] : r.kind === 'buttock' ? [3, 3] : undefined} perfectDrawEnabled={false} />
              ))}
            </Group>
          ))}
          {stations.map((s) => {
            const section = s.id === draggingId ? null : sections.get(s.id);
            if (!section) return null;
            return (
              <SectionShape key={s.id} view={view} section={section} side={sides.get(s.id) ?? 'forward'} selected={s.id === stationId} stationId={s.id} onPick={s.id === stationId ? null : pickStation} />
            );
          })}
          {flags.map((f) => {
            const p = toScreen(view, f.at);
            return <RegularPolygon key={f.key} x={p.x} y={p.y - 2} sides={3} radius={9} stroke={CAUTION} strokeWidth={2.5} listening={false} />;
          })}
          {references.map((r) => {
            const p = toScreen(view, r.labelAt);
            // Waterline names sit inside the right edge, the others just past their line's end.
            return r.kind === 'waterline' ? (
              <KonvaLabel key={`label-${r.lineId}`} x={p.x - 4} y={p.y - 17} text={r.name} size={12} colour="#4a5660" align="end" />
            ) : (
              <KonvaLabel key={`label-${r.lineId}`} x={p.x + 4} y={p.y - 17} text={r.name} size={12} colour="#4a5660" />
            );
          })}
        </>
      );
    },
    [bounds, references, stations, sections, sides, stationId, draggingId, flags, pickStation],
  );

  // Drawn only while a point of its station is dragged; at rest the Part view is where a part is seen.
  const shownPart = preview && livePart && livePart.stationId === preview.stationId ? livePart : null;
  const partSide: 'forward' | 'aft' = shownPart && sides.get(shownPart.stationId) === 'aft' ? 'aft' : 'forward';
  // The widest half-breadth of the part at the chosen station, as dragged or as it stands, for the browser test to read.
  const partHalfBreadth = outlinesHalfBreadth(shownPart?.outlines ?? restOutlines);

  const chosenHandle = handles.find((h) => h.lineId === selection?.lineId) ?? null;
  const drawOverlay = (view: Viewport) => {
    viewRef.current = view;
    return (
      <Group ref={groupRef}>
        {shownPart && <LivePartShape view={view} outlines={shownPart.outlines} side={partSide} />}
        {preview?.section && <SectionShape view={view} section={preview.section} side={sides.get(preview.stationId) ?? 'forward'} selected stationId={preview.stationId} onPick={null} />}
        {handles.map((h) => {
          const p = toScreen(view, drawingPointOf(h.at, handleSide));
          const chosen = selection?.lineId === h.lineId;
          if (readOnly) return <Circle key={h.lineId} x={p.x} y={p.y} radius={3.5} fill={INK} listening={false} />;
          return (
            <Circle
              key={h.lineId}
              name="interactive offset-handle"
              x={p.x}
              y={p.y}
              radius={chosen ? HANDLE_RADIUS_PX + 2 : HANDLE_RADIUS_PX}
              fill={chosen ? INK : '#ffffff'}
              stroke={INK}
              strokeWidth={2}
              hitStrokeWidth={12}
              onPointerDown={(e) => startDrag(h, handleSide, e)}
              onPointerClick={() => latest.current.onSelect({ stationId: h.stationId, lineId: h.lineId })}
            />
          );
        })}
        {chosenHandle && <FocusRing at={toScreen(view, drawingPointOf(chosenHandle.at, handleSide))} />}
      </Group>
    );
  };

  return (
    <div data-testid="body-plan" data-dragging={preview ? 'true' : undefined} data-part-half-breadth={partHalfBreadth === null ? undefined : partHalfBreadth.toFixed(3)}>
      <DrawingStage
        bounds={bounds}
        notation={notation}
        label="Body plan"
        toolbarExtra={toolbarExtra}
        pointerWords={pointerWords}
        overlay={drawOverlay}
        onViewKey={onViewKey}
        viewKeyWords={readOnly ? POINT_KEYS_READ_ONLY : POINT_KEYS}
      >
        {drawStatic}
      </DrawingStage>
      <p className="sr-only" aria-live="polite" aria-atomic="true" data-testid="body-plan-announcement">
        {announcement}
      </p>
      {stationHasParts && !readOnly && (
        // Always there when the station has a part, so the page does not shift when a drag starts.
        <p className="mt-2 flex items-center gap-2 text-sm">
          <svg aria-hidden="true" width="32" height="12" className="shrink-0">
            <line x1="0" y1="6" x2="32" y2="6" stroke={LIVE_PART} strokeWidth={2.5} />
          </svg>
          {LIVE_PART_WORDS}
        </p>
      )}
      {notDrawn.length > 0 && (
        <p className="mt-2 text-caution">
          No section drawn at {notDrawn.map((s) => s.name).join(', ')}: the hull has no section there from these offsets.
        </p>
      )}
    </div>
  );
}
