import { useMemo, useState } from 'react';
import { Circle, Group, Line } from 'react-konva';
import { TriangleAlert } from 'lucide-react';
import { fairingViewOf } from '../../../../../shared/geometry/fairing';
import type { BuiltHull } from '../../../../../shared/geometry/hull';
import type { Notation } from '../../../../../shared/geometry/notation-schema';
import type { Plan } from '../../../../../shared/geometry/plan-schema';
import { Alert } from '../../../../components/ui/alert';
import { SelectField } from '../../../../components/ui/field';
import { fairingChoices, fairingOpeningChoice, fairingShapes, type FairingShapes } from '../../drawing/fairing-shapes';
import { screenPoints } from '../../drawing/screen-points';
import { toScreen, type Viewport } from '../../drawing/viewport';
import { deviationShort, deviationWords } from '../../format';
import { useLinesCheck } from '../../hooks/use-lines-check';
import { DrawingStage } from './drawing-stage';
import { KonvaLabel } from './konva-label';
import { EmptyNote } from '../../../../components/ui/empty-note';

export interface FairingViewProps {
  plan: Plan;
  hull: BuiltHull;
  readOnly: boolean;
  notation: Notation;
  partId?: string;
}

/** The vertical exaggerations offered: enough to make a bump of a few millimetres plain on a long line. */
export const FAIRING_EXAGGERATIONS = [1, 5, 10, 20] as const;

const viewWords = { plan: 'plan (half-breadths)', profile: 'profile (heights)' } as const;

function FairingCanvas({ shapes, view, notation }: { shapes: FairingShapes; view: Viewport; notation: Notation }) {
  const b = shapes.bounds;
  const bottom = toScreen(view, { x: 0, y: b.minY }).y;
  const top = toScreen(view, { x: 0, y: b.maxY }).y;
  return (
    <Group listening={false}>
      {shapes.stations.map((s) => {
        const x = toScreen(view, { x: s.x, y: 0 }).x;
        return (
          <Group key={s.id}>
            <Line points={[x, top - 8, x, bottom + 4]} stroke="#d3cec3" strokeWidth={1} />
            {/* Just under the line's lowest point, inside the stage's fit margin, so the names are never cut off. */}
            <KonvaLabel x={x} y={bottom + 4} text={s.name} size={14} colour="#4a5660" align="centre" />
          </Group>
        );
      })}
      <Line points={screenPoints(view, shapes.curve)} stroke="#1a2329" strokeWidth={2.5} lineJoin="round" />
      {shapes.inflections.map((p, i) => {
        const s = toScreen(view, p);
        return (
          <Group key={`i${i}`}>
            <Line points={[s.x - 8, s.y + 7, s.x + 8, s.y + 7, s.x, s.y - 7]} closed stroke="#6b4a00" strokeWidth={2} />
            <KonvaLabel x={s.x + 10} y={s.y - 24} text="turn" size={13} colour="#6b4a00" />
          </Group>
        );
      })}
      {shapes.cells.map((c) => {
        const s = toScreen(view, c.at);
        if (!c.flag) return <Circle key={c.stationId} x={s.x} y={s.y} radius={5} fill="#0e5466" />;
        const e = toScreen(view, c.flag.expected);
        return (
          <Group key={c.stationId}>
            <Line points={[s.x, s.y, e.x, e.y]} stroke="#a1231b" strokeWidth={2} dash={[5, 4]} />
            <Circle x={e.x} y={e.y} radius={6} stroke="#a1231b" strokeWidth={2} />
            <Circle x={s.x} y={s.y} radius={12} stroke="#a1231b" strokeWidth={3} />
            <Circle x={s.x} y={s.y} radius={5} fill="#a1231b" />
            <KonvaLabel x={s.x + 16} y={s.y} text={`${c.stationName}: ${deviationShort(c.flag.deviationMm, notation)} off`} size={15} colour="#a1231b" bold middle />
          </Group>
        );
      })}
    </Group>
  );
}

/** A line whose values span less than this (mm) is flat: nothing to see at any exaggeration. */
const FLAT_MM = 1;

/**
 * Each line in plan or profile with its values stretched, so that a bump in a run of offsets shows at
 * once, and the cells the fairness check flags marked with how far they stand off the rest of the line.
 */
export function FairingView({ plan, hull, notation }: FairingViewProps) {
  const [exaggeration, setExaggeration] = useState<number>(10);
  // Flattened at the drawn exaggeration, so the curve stays within the chord tolerance on the stretched drawing.
  const fairing = useMemo(() => fairingViewOf(hull, { exaggeration }), [hull, exaggeration]);
  const choices = useMemo(() => fairingChoices(fairing), [fairing]);
  const [chosenKey, setChosenKey] = useState<string | null>(null);
  const check = useLinesCheck(plan.lines);
  const opening = useMemo(() => fairingOpeningChoice(fairing, choices, check.cellFlags, FLAT_MM), [fairing, choices, check.cellFlags]);
  const choice = choices.find((c) => c.key === chosenKey) ?? opening;
  const current = check.lines === plan.lines;
  const shapes = useMemo(() => (choice ? fairingShapes(fairing, choice, check.cellFlags) : null), [fairing, choice, check.cellFlags]);
  const lineFlags = choice ? check.lineFlags.filter((f) => f.lineId === choice.lineId || (f.kind === 'crossing' && f.otherLineId === choice.lineId)) : [];
  const flagged = shapes?.cells.filter((c) => c.flag) ?? [];

  if (!choice || !shapes) return <EmptyNote>The hull has no lines to fair yet.</EmptyNote>;

  return (
    <section aria-labelledby="fairing-view-heading" className="flex flex-col gap-3">
      <h3 id="fairing-view-heading" className="sr-only">Fairing view</h3>
      <div className="flex flex-wrap items-end gap-4">
        <div className="min-w-72">
          <SelectField label="Line" value={choice.key} onChange={(e) => setChosenKey(e.target.value)}>
            {choices.map((c) => (
              <option key={c.key} value={c.key}>
                {c.lineName}
                {c.piece > 0 ? ` (piece ${c.piece + 1})` : ''} in {viewWords[c.view]}
              </option>
            ))}
          </SelectField>
        </div>
        <fieldset className="flex flex-col gap-1.5">
          <legend className="font-semibold">Heights drawn</legend>
          <div className="flex gap-2">
            {FAIRING_EXAGGERATIONS.map((k) => (
              <button
                key={k}
                type="button"
                aria-pressed={k === exaggeration}
                aria-label={`Heights ${k} times`}
                onClick={() => setExaggeration(k)}
                className={`min-h-12 min-w-12 rounded-lg border-2 px-3 font-semibold ${k === exaggeration ? 'border-primary bg-primary text-white' : 'border-edge bg-surface text-ink hover:bg-primary-soft'}`}
              >
                ×{k}
              </button>
            ))}
          </div>
        </fieldset>
      </div>
      {check.issues.length > 0 && current && (
        <Alert tone="error" title="The fairness check cannot run on these lines">
          {check.issues[0]?.message}
        </Alert>
      )}
      <p className="text-base" role="status">
        {!current
          ? 'Checking the lines…'
          : flagged.length === 0
            ? `No cell of ${choice.lineName} stands off the line through the others.`
            : `${flagged.length} cell${flagged.length === 1 ? '' : 's'} of ${choice.lineName} stand${flagged.length === 1 ? 's' : ''} off the line through the others (red ring; the hollow circle is where the rest of the line puts it).`}
      </p>
      <DrawingStage
        // Another line is another drawing: it opens fitted.
        key={choice.key}
        bounds={shapes.bounds}
        notation={notation}
        label={`Fairing view of ${choice.lineName} in ${viewWords[choice.view]}, heights ×${exaggeration}`}
        yScale={exaggeration}
        axisNames={{ x: 'Along', y: choice.view === 'plan' ? 'Half-breadth' : 'Height' }}
      >
        {(view) => <FairingCanvas shapes={shapes} view={view} notation={notation} />}
      </DrawingStage>
      {(flagged.length > 0 || lineFlags.length > 0) && current && (
        <ul aria-label={`Fairness flags on ${choice.lineName}`} className="flex flex-col gap-1">
          {flagged.map((c) => (
            <li key={c.stationId} className="flex items-start gap-2">
              <TriangleAlert aria-hidden="true" className="mt-0.5 size-5 shrink-0 text-caution" />
              <span>
                <span className="font-mono font-semibold">{deviationWords(c.flag!.deviationMm, notation)}</span> {c.flag!.message}
              </span>
            </li>
          ))}
          {lineFlags.map((f, i) => (
            <li key={`line-${i}`} className="flex items-start gap-2">
              <TriangleAlert aria-hidden="true" className="mt-0.5 size-5 shrink-0 text-caution" />
              <span>
                {f.kind === 'crossing' ? <span className="font-mono font-semibold">{deviationShort(f.deviationMm, notation)} </span> : null}
                {f.message}
              </span>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
