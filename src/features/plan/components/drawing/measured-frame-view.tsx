import { useEffect, useMemo, useState } from 'react';
import type Konva from 'konva';
import { Circle, Group, Line, Rect } from 'react-konva';
import { MousePointerClick, Plus } from 'lucide-react';
import type { BuiltHull } from '../../../../../shared/geometry/hull';
import type { Notation } from '../../../../../shared/geometry/notation-schema';
import { lengthFormat, lengthParse } from '../../../../../shared/geometry/notation';
import { measuredFramePoints } from '../../../../../shared/geometry/measured';
import type { MeasuredFrame, Measurement } from '../../../../../shared/geometry/part-schema';
import type { Plan } from '../../../../../shared/geometry/plan-schema';
import { Alert } from '../../../../components/ui/alert';
import { Button } from '../../../../components/ui/button';
import { InputField, SelectField } from '../../../../components/ui/field';
import { partComputeCache } from '../../drawing/part-compute';
import { measuredShapes, type MeasuredShapes } from '../../drawing/measured-shapes';
import { screenPoints } from '../../drawing/screen-points';
import { toHull, toScreen, type Point, type Viewport } from '../../drawing/viewport';
import { measuredFrameAdd, measuredFrameNew, measuredInsertIndex, measuredPointAdd, measuredReadingOf, measuredSettingsSet } from '../../editor/measured-actions';
import { edit } from '../../editor/types';
import { lengthWords } from '../../format';
import { lengthInputMode } from '../../length-field';
import { usePlanEditor } from '../../hooks/use-plan-editor';
import { DrawingStage } from './drawing-stage';
import { KonvaLabel } from './konva-label';
import { MeasuredPointsTable } from './measured-points-table';
import { EmptyNote } from '../../../../components/ui/empty-note';

export interface MeasuredFrameViewProps {
  plan: Plan;
  hull: BuiltHull;
  readOnly: boolean;
  notation: Notation;
  partId?: string;
}

/** The click catcher reaches this far (px) past the stage every way, whatever the stage's size. */
const CATCH_PX = 20_000;

function MeasuredCanvas({ shapes, view, adding, onAdd }: { shapes: MeasuredShapes; view: Viewport; adding: boolean; onAdd: (p: Point) => void }) {
  // The bounds hold a margin round the frame: the reference line and the side names use it.
  const b = shapes.bounds;
  const left = toScreen(view, { x: b.minX, y: 0 }).x;
  const right = toScreen(view, { x: b.maxX, y: 0 }).x;
  const top = toScreen(view, { x: 0, y: b.maxY }).y;
  const bottom = toScreen(view, { x: 0, y: b.minY }).y;
  const centre = toScreen(view, { x: 0, y: 0 }).x;
  const onClick = (e: Konva.KonvaEventObject<Event>) => {
    const at = e.target.getStage()?.getPointerPosition();
    if (at) onAdd(toHull(view, at));
  };
  return (
    <>
      <Group listening={false}>
        {shapes.filletBands.map((band, i) => <Line key={`f${i}`} points={screenPoints(view, band)} closed fill="rgba(242, 184, 75, 0.85)" stroke="rgba(230, 160, 40, 0.95)" strokeWidth={3} />)}
        <Line points={[centre, top, centre, bottom]} stroke="#1d4ed8" strokeWidth={1.5} dash={[18, 5, 4, 5]} />
        {shapes.referenceZ !== null && (
          <>
            <Line points={[left, toScreen(view, { x: 0, y: shapes.referenceZ }).y, right, toScreen(view, { x: 0, y: shapes.referenceZ }).y]} stroke="#1f6b3a" strokeWidth={2} />
            <KonvaLabel x={right} y={toScreen(view, { x: 0, y: shapes.referenceZ }).y - 22} text="Reference line" size={14} colour="#1f6b3a" bold align="end" />
          </>
        )}
        {shapes.origin && (
          <>
            {shapes.readings.map((r) => <Line key={`ray${r.number}`} points={screenPoints(view, [shapes.origin!, r.at])} stroke="#9aa3aa" strokeWidth={1} dash={[4, 4]} />)}
            <Circle {...toScreen(view, shapes.origin)} radius={7} stroke="#1f6b3a" strokeWidth={2} />
            <KonvaLabel x={toScreen(view, shapes.origin).x + 10} y={toScreen(view, shapes.origin).y + 6} text="Origin" size={14} colour="#1f6b3a" bold />
          </>
        )}
        {shapes.otherFaces.map((loop, i) => <Line key={`o${i}`} points={screenPoints(view, loop)} closed stroke="#0e5466" strokeWidth={2} dash={[10, 6]} />)}
        {shapes.cutEdges.map((loop, i) => <Line key={`c${i}`} points={screenPoints(view, loop)} closed stroke="#1a2329" strokeWidth={3} lineJoin="round" />)}
        {shapes.otherSideMirrored && <Line points={screenPoints(view, shapes.otherSideMirrored)} stroke="#a1231b" strokeWidth={2} dash={[6, 4]} />}
        {shapes.asMeasured.length > 1 && <Line points={screenPoints(view, shapes.asMeasured)} stroke="#5f6a72" strokeWidth={1.5} />}
        {shapes.readings.map((r) => {
          const s = toScreen(view, r.at);
          return (
            <Group key={`r${r.number}`}>
              <Circle x={s.x} y={s.y} radius={7} fill="#0e5466" stroke="#ffffff" strokeWidth={2} />
              <KonvaLabel x={s.x + 10} y={s.y - 10} text={r.bevelText ? `${r.number} · ${r.bevelText}` : String(r.number)} size={14} colour="#0a3f4d" bold middle />
            </Group>
          );
        })}
        <KonvaLabel x={left} y={top - 4} text="Port" size={16} colour="#1a2329" bold />
        <KonvaLabel x={right} y={top - 4} text="Starboard" size={16} colour="#1a2329" bold align="end" />
      </Group>
      {/* Named "interactive" so the stage leaves a click on it to this view rather than panning. */}
      {adding && <Rect name="interactive" x={-CATCH_PX} y={-CATCH_PX} width={2 * CATCH_PX} height={2 * CATCH_PX} fill="rgba(0,0,0,0)" onClick={onClick} onTap={onClick} />}
    </>
  );
}

function NewMeasuredFrame({ plan, notation, onAdded }: { plan: Plan; notation: Notation; onAdded: (id: string) => void }) {
  const { store } = usePlanEditor();
  const [x, setX] = useState('');
  const [kind, setKind] = useState<Measurement['kind']>('offsets');
  const [error, setError] = useState<string | undefined>();
  return (
    <form
      aria-label="Add a measured frame"
      className="flex flex-wrap items-start gap-3"
      onSubmit={(e) => {
        e.preventDefault();
        const read = lengthParse(x, notation);
        if (!read || !read.ok) {
          setError(read ? `Frame x: ${read.message}` : 'Enter where the frame stands (x along the hull)');
          return;
        }
        const frame = measuredFrameNew(plan, { x: read.mm, kind });
        store.getState().apply(edit(`Add ${frame.name}`, measuredFrameAdd, { frame }));
        onAdded(frame.id);
      }}
    >
      <div className="w-48">
        <InputField label={`Frame x (${notation.unit === 'mm' ? 'mm' : 'in'})`} inputMode={lengthInputMode(notation)} value={x} error={error} onChange={(e) => setX(e.target.value)} />
      </div>
      <div className="w-64">
        <SelectField label="Measured by" value={kind} onChange={(e) => setKind(e.target.value as Measurement['kind'])}>
          <option value="offsets">Offsets from centreline and a level line</option>
          <option value="angle-distance">Angle and distance from an origin</option>
        </SelectField>
      </div>
      <Button type="submit" className="mt-8">
        <Plus aria-hidden="true" className="size-5" />
        Add a measured frame
      </Button>
    </form>
  );
}

/** x, how it was measured from (reference line or origin), symmetry and the face the readings were taken on. */
function FrameSettings({ frame, notation, readOnly }: { frame: MeasuredFrame; notation: Notation; readOnly: boolean }) {
  const { store } = usePlanEditor();
  const [errors, setErrors] = useState<Record<string, string>>({});
  const m = frame.measurement;
  const unit = notation.unit === 'mm' ? 'mm' : 'in';
  const length = (key: string, words: string, mm: number, put: (v: number) => Parameters<typeof measuredSettingsSet>[1]) => (
    <div className="w-44">
      <InputField
        key={`${key}:${mm}`}
        label={`${words} (${unit})`}
        defaultValue={lengthFormat(mm, notation)}
        readOnly={readOnly}
        inputMode={lengthInputMode(notation)}
        error={errors[key]}
        onBlur={(e) => {
          const read = lengthParse(e.target.value, notation);
          if (!read || !read.ok) {
            setErrors((x) => ({ ...x, [key]: `${words}: ${read ? read.message : 'enter a length'}. Nothing was changed.` }));
            return;
          }
          setErrors(({ [key]: _gone, ...rest }) => rest);
          store.getState().apply(edit(`Change ${frame.name}`, measuredSettingsSet, put(read.mm)));
        }}
      />
    </div>
  );
  return (
    <div className="flex flex-wrap items-start gap-3">
      {length('x', 'Frame x', frame.x, (v) => ({ partId: frame.id, x: v }))}
      {m.kind === 'offsets' && length('ref', 'Reference line height', m.referenceZ, (v) => ({ partId: frame.id, referenceZ: v }))}
      {m.kind === 'angle-distance' && length('oy', 'Origin offset', m.origin.y, (v) => ({ partId: frame.id, origin: { y: v, z: m.origin.z } }))}
      {m.kind === 'angle-distance' && length('oz', 'Origin height', m.origin.z, (v) => ({ partId: frame.id, origin: { y: m.origin.y, z: v } }))}
      <div className="w-60">
        <SelectField label="Sides" value={frame.symmetry} disabled={readOnly} onChange={(e) => store.getState().apply(edit(`Change ${frame.name}`, measuredSettingsSet, { partId: frame.id, symmetry: e.target.value as MeasuredFrame['symmetry'] }))}>
          <option value="as-measured">Both sides as measured</option>
          <option value="mirror-starboard">Starboard side, mirrored</option>
          <option value="mirror-port">Port side, mirrored</option>
        </SelectField>
      </div>
      <div className="w-48">
        <SelectField label="Measured on the" value={frame.measuredFace} disabled={readOnly} onChange={(e) => store.getState().apply(edit(`Change ${frame.name}`, measuredSettingsSet, { partId: frame.id, measuredFace: e.target.value as MeasuredFrame['measuredFace'] }))}>
          <option value="aft">aft face</option>
          <option value="forward">forward face</option>
        </SelectField>
      </div>
    </div>
  );
}

/**
 * A frame measured on a standing hull: its readings typed into a side table (or clicked onto the
 * drawing), and the frame drawn from them as it will be cut, with the other side laid over when one side
 * is mirrored so the hull's asymmetry shows.
 */
export function MeasuredFrameView({ plan, hull, readOnly, notation, partId }: MeasuredFrameViewProps) {
  const { store } = usePlanEditor();
  const frames = plan.parts.parts.filter((p): p is MeasuredFrame => p.kind === 'measured-frame');
  const [chosenId, setChosenId] = useState<string | null>(partId ?? null);
  useEffect(() => {
    if (partId) setChosenId(partId);
  }, [partId]);
  const frame = frames.find((f) => f.id === chosenId) ?? frames[0] ?? null;
  const [adding, setAdding] = useState(false);
  const [showNew, setShowNew] = useState(false);
  const [fitRound, setFitRound] = useState(0);
  const [compute] = useState(partComputeCache);
  const longitudinals = plan.parts.longitudinals;
  const computed = useMemo(() => (frame && frame.measurement.points.length >= 3 ? compute(hull, frame, longitudinals) : null), [compute, hull, frame, longitudinals]);
  const shapes = useMemo(() => (frame ? measuredShapes(frame, computed?.result ?? null, computed?.hullEdges ?? null) : null), [frame, computed]);

  const addAt = (p: Point) => {
    if (!frame || readOnly) return;
    const m = frame.measurement;
    const reading = measuredReadingOf(m, { y: p.x, z: p.y });
    const index = measuredInsertIndex(measuredFramePoints(m), { y: p.x, z: p.y });
    store.getState().apply(edit(`Add point ${index + 1} to ${frame.name}`, measuredPointAdd, { partId: frame.id, reading, index }));
  };

  return (
    <section aria-labelledby="measured-view-heading" className="flex flex-col gap-4">
      <h3 id="measured-view-heading" className="sr-only">Hand-measured frame</h3>
      {frames.length > 0 && (
        <div className="min-w-64 max-w-md">
          <SelectField label="Measured frame" value={frame?.id ?? ''} onChange={(e) => setChosenId(e.target.value)}>
            {frames.map((f) => (
              <option key={f.id} value={f.id}>
                {f.name} at x {lengthWords(f.x, notation)}
              </option>
            ))}
          </SelectField>
        </div>
      )}
      {frames.length === 0 && <EmptyNote>No frame has been measured on this hull yet.</EmptyNote>}
      {!readOnly && (frames.length === 0 || showNew) && (
        <NewMeasuredFrame
          plan={plan}
          notation={notation}
          onAdded={(id) => {
            setChosenId(id);
            setShowNew(false);
          }}
        />
      )}
      {!readOnly && frames.length > 0 && !showNew && (
        <div>
          <Button variant="secondary" onClick={() => setShowNew(true)}>
            <Plus aria-hidden="true" className="size-5" />
            Measure another frame
          </Button>
        </div>
      )}
      {frame && shapes && (
        <>
          <FrameSettings key={frame.id} frame={frame} notation={notation} readOnly={readOnly} />
          {frame.measurement.points.length < 3 && (
            <Alert tone="info" title="At least three points make a frame">
              {frame.name} has {frame.measurement.points.length} point{frame.measurement.points.length === 1 ? '' : 's'}. Take them in order along the edge, from one sheer round to the other (or from the centreline out on one side, and mirror it).
            </Alert>
          )}
          {computed && !computed.result.ok && (
            <Alert tone="error" title={`${frame.name} cannot be worked out from these readings`}>
              <ul className="list-disc pl-6">
                {computed.result.issues.map((issue, i) => (
                  <li key={`${issue.code}-${i}`}>{issue.message}</li>
                ))}
              </ul>
            </Alert>
          )}
          {computed?.result.ok && computed.result.part.bevelSummary.overLimit > 0 && (
            <Alert tone="error" title="Bevel past the saw's limit">
              {computed.result.part.bevelSummary.overLimit} bevel mark{computed.result.part.bevelSummary.overLimit === 1 ? ' is' : 's are'} past the saw tilt limit of this frame; see the Part view for where.
            </Alert>
          )}
          {shapes.maxAsymmetryMm !== null && (
            <Alert tone={shapes.maxAsymmetryMm > 5 ? 'caution' : 'info'} title={`The two sides differ by up to ${lengthWords(shapes.maxAsymmetryMm, notation)}`}>
              The red dashed line is the other side as measured, laid over the side that is kept. Where they part, the hull is not the same both sides: check the readings there before cutting a mirrored frame.
            </Alert>
          )}
          {/* The table's column has a set width, so rows being added never resize the drawing under the pointer. */}
          <div className="grid grid-cols-1 items-start gap-4 xl:grid-cols-[minmax(0,1fr)_31rem]">
            <DrawingStage
              // Fitted afresh for another frame and after a point typed into the table (a point clicked onto the
              // drawing leaves it where it is, so the next click lands where the person aims).
              key={`${frame.id}:${fitRound}`}
              bounds={shapes.bounds}
              notation={notation}
              label={`Drawing of ${frame.name} from its readings`}
              toolbarExtra={
                !readOnly && (
                  <Button variant={adding ? 'primary' : 'secondary'} aria-pressed={adding} onClick={() => setAdding((a) => !a)}>
                    <MousePointerClick aria-hidden="true" className="size-5" />
                    Add points by clicking
                  </Button>
                )
              }
            >
              {(view) => <MeasuredCanvas shapes={shapes} view={view} adding={adding && !readOnly} onAdd={addAt} />}
            </DrawingStage>
            <MeasuredPointsTable frame={frame} plan={plan} notation={notation} readOnly={readOnly} apply={(e) => store.getState().apply(e)} onAdded={() => setFitRound((n) => n + 1)} />
          </div>
          <p className="text-sm text-muted">Seen from aft, starboard on the right. Black: the frame as it will be cut (fillet clearance in amber taken off the readings); dashed: its other face from the bevel readings.</p>
        </>
      )}
    </section>
  );
}
