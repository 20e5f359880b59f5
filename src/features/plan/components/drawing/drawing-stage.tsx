import { useCallback, useEffect, useLayoutEffect, useMemo, useRef, useState, type KeyboardEvent as ReactKeyboardEvent, type PointerEvent as ReactPointerEvent, type ReactNode } from 'react';
import type Konva from 'konva';
import { Circle, Layer, Line, Stage, Text } from 'react-konva';
import { Maximize, Ruler, ZoomIn, ZoomOut } from 'lucide-react';
import { Button } from '../../../../components/ui/button';
import type { Notation } from '../../../../../shared/geometry/notation-schema';
import { degreesWords, lengthWords } from '../../format';
import { fitViewport, measureBetween, panBy, toHull, toScreen, viewportEqual, zoomAbout, type Bounds, type Point, type Viewport } from '../../drawing/viewport';

export interface DrawingStageProps {
  /** What "Fit" shows (hull mm). */
  bounds: Bounds;
  /** Read-outs in the hull's units. */
  notation: Notation;
  /** Accessible name of the drawing. */
  label: string;
  /** px; by default the drawing fills the height left in the window (at least 420 px). */
  height?: number;
  /** Vertical exaggeration (the fairing view): hull y is multiplied by this before mapping. Default 1. */
  yScale?: number;
  /** Konva shapes (Layer contents) for the current viewport. */
  children: (view: Viewport) => ReactNode;
  /**
   * Shapes drawn on a layer of their own above the rest: what changes on every pointer move (a dragged
   * point and its section), so a frame redraws only that layer.
   */
  overlay?: (view: Viewport) => ReactNode;
  /** Extra buttons the view adds to the toolbar. */
  toolbarExtra?: ReactNode;
  /** What the read-out calls the two axes (default "Across" and "Height"). */
  axisNames?: { x: string; y: string };
  /** The read-out for the hull point under the pointer, when the view words it its own way. */
  pointerWords?: (p: Point) => string;
  /**
   * The view's own keys, asked before the stage's: true when the view took the key (an arrow moving a
   * chosen point rather than the drawing), so the stage leaves it alone.
   */
  onViewKey?: (e: ReactKeyboardEvent<HTMLDivElement>) => boolean;
  /** The view's keys in words, added to the drawing's accessible name. */
  viewKeyWords?: string;
}

const FIT_MARGIN_PX = 32;
const MIN_HEIGHT_PX = 420;
/** One press of Zoom in / Zoom out or of + / -. */
const ZOOM_STEP = 1.25;
/** Arrow keys move the drawing by this share of its size (Shift: three times as far). */
const PAN_STEP_SHARE = 0.1;
/** A pointer that moves less than this between down and up is a click (measure), not a pan. */
const CLICK_SLOP_PX = 4;
/** Bounds that move by more than this share of the drawing's size are a new drawing, fitted again. */
const BOUNDS_CHANGE_REFIT_SHARE = 0.2;

/**
 * A pointer on a shape that takes the pointer (a drag handle, anything `draggable`, or a shape whose name
 * holds "interactive") belongs to the shape; anywhere else it pans the drawing.
 */
function takesPointer(node: Konva.Node | null): boolean {
  for (let n: Konva.Node | null = node; n && n.getType() !== 'Stage'; n = n.getParent()) {
    if (n.draggable() || n.name().includes('interactive')) return true;
  }
  return false;
}

/** Wheel delta in px whatever the device reports (lines on some mice, pages rarely). */
function wheelPixels(e: WheelEvent): number {
  return e.deltaMode === 1 ? e.deltaY * 16 : e.deltaMode === 2 ? e.deltaY * 400 : e.deltaY;
}

/** Room the toolbar above and the read-out below take, so that drawing, toolbar and read-out fit the window together. */
const CHROME_PX = 170;

/** The window's height less the toolbar and read-out: scrolled to, the drawing fills the screen. */
function fillHeight(): number {
  return Math.max(MIN_HEIGHT_PX, Math.round(window.innerHeight - CHROME_PX));
}

interface Measure {
  a: Point;
  b: Point | null;
}

/**
 * The frame every drawing sits in: a toolbar (fit, zoom, measure and the view's own buttons), a konva stage
 * sized to its container that pans and zooms with wheel, trackpad, pointer and keys, a read-out of the hull
 * position under the pointer and a measure tool. The view draws its shapes for the viewport it is given.
 */
export function DrawingStage({ bounds, notation, label, height, yScale = 1, children, overlay, toolbarExtra, axisNames = { x: 'Across', y: 'Height' }, pointerWords, onViewKey, viewKeyWords }: DrawingStageProps) {
  const boxRef = useRef<HTMLDivElement>(null);
  const stageRef = useRef<Konva.Stage>(null);
  const [size, setSize] = useState({ width: 0, height: height ?? MIN_HEIGHT_PX });
  const [view, setView] = useState<Viewport | null>(null);
  // Until the person pans or zooms, the drawing keeps itself fitted (to its container and its bounds).
  const [fitted, setFitted] = useState(true);
  const [measuring, setMeasuring] = useState(false);
  const [measure, setMeasure] = useState<Measure | null>(null);
  const [pointer, setPointer] = useState<Point | null>(null);
  const spaceDown = useRef(false);
  const pan = useRef<{ id: number; x: number; y: number; startX: number; startY: number; moved: boolean } | null>(null);
  const pendingPan = useRef<{ dx: number; dy: number } | null>(null);
  const panFrame = useRef(0);

  const fit = useCallback(() => {
    if (size.width <= 0) return;
    const next = fitViewport(bounds, size, FIT_MARGIN_PX, yScale);
    setView((v) => (v && viewportEqual(v, next) ? v : next));
  }, [bounds.minX, bounds.minY, bounds.maxX, bounds.maxY, size.width, size.height, yScale]);

  useLayoutEffect(() => {
    const el = boxRef.current;
    if (!el) return;
    const measureBox = () => setSize((s) => {
      const next = { width: Math.floor(el.clientWidth), height: height ?? fillHeight() };
      return s.width === next.width && s.height === next.height ? s : next;
    });
    measureBox();
    const observer = new ResizeObserver(measureBox);
    observer.observe(el);
    window.addEventListener('resize', measureBox);
    return () => {
      observer.disconnect();
      window.removeEventListener('resize', measureBox);
    };
  }, [height]);

  // Refit when the container changes size (or on first layout), but not when the bounds change: a point
  // dragged outward must not make the drawing jump under the pointer. Fit (or 0) takes the new bounds.
  const fitRef = useRef(fit);
  fitRef.current = fit;
  const fittedRef = useRef(fitted);
  fittedRef.current = fitted;
  const hasView = useRef(false);
  hasView.current = view !== null;
  useEffect(() => {
    if (fittedRef.current || !hasView.current) fitRef.current();
  }, [size.width, size.height, yScale]);
  // A new drawing in the same frame (another part chosen) refits while the person has not moved it; the
  // small change a dragged point makes to the bounds does not.
  const fittedBounds = useRef(bounds);
  useEffect(() => {
    const was = fittedBounds.current;
    const extent = Math.max(was.maxX - was.minX, was.maxY - was.minY, 1);
    const moved = Math.max(Math.abs(bounds.minX - was.minX), Math.abs(bounds.maxX - was.maxX), Math.abs(bounds.minY - was.minY), Math.abs(bounds.maxY - was.maxY));
    if (moved <= BOUNDS_CHANGE_REFIT_SHARE * extent) return;
    fittedBounds.current = bounds;
    if (fittedRef.current) fitRef.current();
  }, [bounds]);

  // A change of vertical exaggeration keeps the place but redraws heights at the new scale.
  useEffect(() => {
    setView((v) => (v && (v.yScale ?? 1) !== yScale ? { ...v, yScale } : v));
  }, [yScale]);

  useEffect(() => () => cancelAnimationFrame(panFrame.current), []);

  const centre = { x: size.width / 2, y: size.height / 2 };
  const zoomBy = (factor: number, about: Point = centre) => {
    setFitted(false);
    setView((v) => (v ? zoomAbout(v, factor, about) : v));
  };
  const panByPx = (dx: number, dy: number) => {
    setFitted(false);
    setView((v) => (v ? panBy(v, dx, dy) : v));
  };
  const fitNow = () => {
    setFitted(true);
    fittedBounds.current = bounds;
    fit();
  };

  // Konva's own wheel event carries the pointer position on the stage.
  const onWheel = (e: Konva.KonvaEventObject<WheelEvent>) => {
    e.evt.preventDefault();
    const stage = stageRef.current;
    const at = stage?.getPointerPosition() ?? centre;
    if (e.evt.shiftKey && !e.evt.ctrlKey) {
      panByPx(-wheelPixels(e.evt), 0);
      return;
    }
    // Trackpad pinches arrive as ctrl+wheel with small deltas: they need a stronger response per px.
    const perPx = e.evt.ctrlKey ? 0.01 : 0.0015;
    zoomBy(Math.exp(-wheelPixels(e.evt) * perPx), at);
  };

  const localPoint = (e: { clientX: number; clientY: number }): Point => {
    const r = boxRef.current!.getBoundingClientRect();
    return { x: e.clientX - r.left, y: e.clientY - r.top };
  };

  const onPointerDown = (e: ReactPointerEvent<HTMLDivElement>) => {
    const stage = stageRef.current;
    if (!stage || !view) return;
    const at = localPoint(e);
    const onShape = takesPointer(stage.getIntersection(at));
    const forcePan = e.button === 1 || spaceDown.current;
    if (e.button !== 0 && e.button !== 1) return;
    if (onShape && !forcePan && !measuring) return;
    if (e.button === 1) e.preventDefault();
    pan.current = { id: e.pointerId, x: at.x, y: at.y, startX: at.x, startY: at.y, moved: false };
    boxRef.current?.setPointerCapture?.(e.pointerId);
  };

  const onPointerMove = (e: ReactPointerEvent<HTMLDivElement>) => {
    const at = localPoint(e);
    if (view) setPointer(toHull(view, at));
    const p = pan.current;
    if (!p || p.id !== e.pointerId) return;
    if (!p.moved && Math.hypot(at.x - p.startX, at.y - p.startY) < CLICK_SLOP_PX) return;
    if (measuring && !spaceDown.current && e.buttons !== 4) return; // in measure mode a left drag is not a pan
    p.moved = true;
    const step = pendingPan.current ?? { dx: 0, dy: 0 };
    pendingPan.current = { dx: step.dx + at.x - p.x, dy: step.dy + at.y - p.y };
    p.x = at.x;
    p.y = at.y;
    // Pan at most once a frame: pointer events can come faster than the screen paints.
    if (!panFrame.current) {
      panFrame.current = requestAnimationFrame(() => {
        panFrame.current = 0;
        const d = pendingPan.current;
        pendingPan.current = null;
        if (d) panByPx(d.dx, d.dy);
      });
    }
  };

  const onPointerUp = (e: ReactPointerEvent<HTMLDivElement>) => {
    const p = pan.current;
    if (!p || p.id !== e.pointerId) return;
    pan.current = null;
    boxRef.current?.releasePointerCapture?.(e.pointerId);
    if (!p.moved && measuring && view && e.button === 0) {
      const at = toHull(view, localPoint(e));
      setMeasure((m) => (!m || m.b ? { a: at, b: null } : { a: m.a, b: at }));
    }
  };

  const onKeyDown = (e: ReactKeyboardEvent<HTMLDivElement>) => {
    if (e.ctrlKey || e.metaKey || e.altKey) return; // Ctrl+Z and friends belong to the screen
    if (onViewKey?.(e)) {
      e.preventDefault();
      return;
    }
    const step = (e.shiftKey ? 3 : 1) * PAN_STEP_SHARE;
    const keys: Record<string, () => void> = {
      '+': () => zoomBy(ZOOM_STEP),
      '=': () => zoomBy(ZOOM_STEP),
      '-': () => zoomBy(1 / ZOOM_STEP),
      _: () => zoomBy(1 / ZOOM_STEP),
      '0': fitNow,
      ArrowLeft: () => panByPx(size.width * step, 0),
      ArrowRight: () => panByPx(-size.width * step, 0),
      ArrowUp: () => panByPx(0, size.height * step),
      ArrowDown: () => panByPx(0, -size.height * step),
      Escape: () => setMeasure(null),
    };
    const run = keys[e.key];
    if (e.key === ' ') {
      spaceDown.current = true;
      e.preventDefault();
    } else if (run) {
      run();
      e.preventDefault();
    }
  };
  const onKeyUp = (e: ReactKeyboardEvent<HTMLDivElement>) => {
    if (e.key === ' ') spaceDown.current = false;
  };

  // The read-out changes on every pointer move; the drawing only when the view or the view's shapes do.
  const drawn = useMemo(() => (view ? children(view) : null), [children, view]);
  const drawnOver = useMemo(() => (view && overlay ? overlay(view) : null), [overlay, view]);

  const measured = measure?.b ? measureBetween(measure.a, measure.b) : null;
  const measureWords = measured ? `Distance ${lengthWords(measured.distanceMm, notation)}, angle from horizontal ${degreesWords(measured.angleRad)}` : null;

  return (
    <div className="flex flex-col gap-2" data-testid="drawing-stage" data-viewport={view ? JSON.stringify({ ...view, yScale: view.yScale ?? 1, width: size.width, height: size.height }) : undefined}>
      <div role="toolbar" aria-label={`${label}: view`} className="flex flex-wrap items-center gap-2">
        <Button variant="secondary" onClick={fitNow} aria-label="Fit the drawing to the view" title="Fit (0)">
          <Maximize aria-hidden="true" className="size-5" />
          Fit
        </Button>
        <Button variant="secondary" onClick={() => zoomBy(ZOOM_STEP)} aria-label="Zoom in" title="Zoom in (+)">
          <ZoomIn aria-hidden="true" className="size-5" />
          Zoom in
        </Button>
        <Button variant="secondary" onClick={() => zoomBy(1 / ZOOM_STEP)} aria-label="Zoom out" title="Zoom out (−)">
          <ZoomOut aria-hidden="true" className="size-5" />
          Zoom out
        </Button>
        <Button
          variant={measuring ? 'primary' : 'secondary'}
          aria-pressed={measuring}
          onClick={() => {
            setMeasuring((m) => !m);
            setMeasure(null);
          }}
          title="Measure: click two points"
        >
          <Ruler aria-hidden="true" className="size-5" />
          Measure
        </Button>
        {toolbarExtra}
      </div>
      <div
        ref={boxRef}
        tabIndex={0}
        role="application"
        aria-roledescription="drawing"
        aria-label={`${label}. Plus and minus zoom, 0 fits, arrow keys move the drawing.${viewKeyWords ? ` ${viewKeyWords}` : ''}`}
        className={`relative w-full touch-none overflow-hidden rounded-xl border-2 border-edge bg-white outline-none focus-visible:ring-4 focus-visible:ring-primary ${measuring ? 'cursor-crosshair' : ''}`}
        style={{ height: size.height }}
        onPointerDown={onPointerDown}
        onPointerMove={onPointerMove}
        onPointerUp={onPointerUp}
        onPointerCancel={onPointerUp}
        onPointerLeave={() => setPointer(null)}
        onKeyDown={onKeyDown}
        onKeyUp={onKeyUp}
        onBlur={() => (spaceDown.current = false)}
        onAuxClick={(e) => e.preventDefault()}
      >
        {size.width > 0 && view && (
          <Stage ref={stageRef} width={size.width} height={size.height} onWheel={onWheel}>
            <Layer>{drawn}</Layer>
            {overlay && <Layer>{drawnOver}</Layer>}
            {measure && <MeasureLayer view={view} measure={measure} words={measured ? `${lengthWords(measured.distanceMm, notation)}  ${degreesWords(measured.angleRad)}` : null} />}
          </Stage>
        )}
      </div>
      <div className="flex flex-wrap items-center justify-between gap-x-6 gap-y-1 text-base" aria-live="off">
        <p data-testid="pointer-readout" className="font-mono">
          {pointer
            ? (pointerWords?.(pointer) ?? `${axisNames.x} ${lengthWords(pointer.x, notation)} · ${axisNames.y} ${lengthWords(pointer.y, notation)}`)
            : 'Point at the drawing to read a position.'}
        </p>
        {measuring && (
          <p data-testid="measure-readout" role="status" className="font-semibold">
            {measureWords ?? (measure ? 'Click the second point.' : 'Click the first point to measure from.')}
          </p>
        )}
      </div>
    </div>
  );
}

function MeasureLayer({ view, measure, words }: { view: Viewport; measure: Measure; words: string | null }) {
  const a = toScreen(view, measure.a);
  const b = measure.b ? toScreen(view, measure.b) : null;
  return (
    <Layer listening={false}>
      <Circle x={a.x} y={a.y} radius={5} stroke="#b45309" strokeWidth={2} />
      {b && (
        <>
          <Line points={[a.x, a.y, b.x, b.y]} stroke="#b45309" strokeWidth={2} dash={[8, 4]} />
          <Circle x={b.x} y={b.y} radius={5} stroke="#b45309" strokeWidth={2} />
          {words && <Text x={(a.x + b.x) / 2 + 8} y={(a.y + b.y) / 2 + 8} text={words} fontSize={16} fontStyle="bold" fill="#7c2d12" />}
        </>
      )}
    </Layer>
  );
}
