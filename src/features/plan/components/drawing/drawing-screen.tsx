import { useEffect, useMemo, useRef, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { Eye, Hand } from 'lucide-react';
import { hullCheck } from '../../../../../shared/geometry/hull';
import type { Station } from '../../../../../shared/geometry/hull-schema';
import { Alert } from '../../../../components/ui/alert';
import { Button } from '../../../../components/ui/button';
import type { Edit } from '../../editor/types';
import { useLinesCheck } from '../../hooks/use-lines-check';
import { useEditor, usePlanEditor } from '../../hooks/use-plan-editor';
import { stationsInOrder } from '../../drawing/body-plan';
import { createSectionCache } from '../../drawing/station-section';
import { BodyPlanView, type OffsetSelection } from './body-plan-view';
import { FairingView } from './fairing-view';
import { MeasuredFrameView } from './measured-frame-view';
import { PartView } from './part-view';
import { StationOffsetsPanel } from './station-offsets-panel';

const VIEWS = [
  { id: 'body-plan', label: 'Body plan' },
  { id: 'fairing', label: 'Fairing' },
  { id: 'part', label: 'Part' },
  { id: 'measured', label: 'Measured frame' },
] as const;
type ViewId = (typeof VIEWS)[number]['id'];

const isViewId = (v: string | null): v is ViewId => VIEWS.some((x) => x.id === v);

/** Keys that belong to a text field (its own undo), not to the drawing's. */
function typingIn(target: EventTarget | null): boolean {
  const el = target as HTMLElement | null;
  return !!el && (el.tagName === 'INPUT' || el.tagName === 'TEXTAREA' || el.tagName === 'SELECT' || el.isContentEditable);
}

/** Ctrl/Cmd+Z undoes, Ctrl+Shift+Z or Ctrl+Y redoes, through the one store the table uses too. */
function useUndoKeys(enabled: boolean) {
  const { store } = usePlanEditor();
  useEffect(() => {
    if (!enabled) return undefined;
    const onKey = (e: KeyboardEvent) => {
      if (!(e.ctrlKey || e.metaKey) || e.altKey || typingIn(e.target)) return;
      const key = e.key.toLowerCase();
      if (key === 'z' && !e.shiftKey) store.getState().undoLast();
      else if ((key === 'z' && e.shiftKey) || key === 'y') store.getState().redoLast();
      else return;
      e.preventDefault();
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [enabled, store]);
}

/** The station a body plan opens on: the one nearest midships, where the sections are fullest. */
function middleStation(stations: readonly Station[]): string | null {
  const sorted = stationsInOrder(stations);
  return sorted[Math.floor(sorted.length / 2)]?.id ?? null;
}

/**
 * The Drawing screen: the hull's lines and parts drawn, in four views: the body plan (edited by dragging
 * offsets), the fairing view, one part, and a hand-measured frame. Every edit goes through the editor's
 * store, so the Lines table, the undo steps and the autosaved draft are the same whichever screen made it.
 */
export function DrawingScreen() {
  const { hull: hullSummary, canEditLines, canEditParts, store } = usePlanEditor();
  const plan = useEditor((s) => s.plan);
  const lines = plan.lines;
  const notation = lines.notation;
  const built = useMemo(() => hullCheck(lines), [lines]);
  const check = useLinesCheck(lines);
  const [params, setParams] = useSearchParams();
  const viewParam = params.get('view');
  const view: ViewId = isViewId(viewParam) ? viewParam : 'body-plan';
  const partId = params.get('part') ?? undefined;
  const [picked, setPicked] = useState<OffsetSelection | null>(null);
  const sectionCache = useRef(createSectionCache());
  useUndoKeys(canEditLines || canEditParts);

  // The chosen station, or midships when none is chosen (or the chosen one was deleted).
  const selection: OffsetSelection | null =
    picked && lines.stations.some((s) => s.id === picked.stationId) ? picked : (() => {
      const id = middleStation(lines.stations);
      return id ? { stationId: id, lineId: null } : null;
    })();
  const selectedSection = selection && built.ok ? sectionCache.current(lines, selection.stationId, built.hull) : null;

  const choose = (id: ViewId) =>
    setParams((p) => {
      const next = new URLSearchParams(p);
      if (id === 'body-plan') next.delete('view');
      else next.set('view', id);
      return next;
    });
  const onEdit = (e: Edit) => store.getState().apply(e);

  return (
    <div className="flex flex-col gap-4">
      <title>{`Drawing · ${hullSummary.name} · Loftbench`}</title>
      <div className="flex flex-col gap-2">
        <h2 className="text-2xl font-bold">Drawing</h2>
        {!canEditLines ? (
          <Alert tone="info" title="Read only">
            As a helper on this hull you can look at the drawings, pan, zoom and measure, but not change the lines or the parts. In the body plan, with the drawing focused, N and P
            step through the chosen section's points and read each one out.
          </Alert>
        ) : (
          <p className="flex max-w-prose items-start gap-2 text-muted">
            <Hand aria-hidden="true" className="mt-0.5 size-5 shrink-0" />
            <span>
              Pick a section to work on, then drag its points: a waterline point moves across, a buttock point up and down, a diagonal point along its diagonal, a sheer, chine or
              keel point anywhere. Click a point and press Delete to take it out. Drag the background to move the drawing, the wheel zooms. Ctrl+Z undoes. From the keyboard: focus the
              drawing, N and P step through the section's points, the arrow keys move the chosen point one step the way it may go (Shift ten steps), Escape lets go of it.
            </span>
          </p>
        )}
      </div>
      <div role="group" aria-label="Which drawing" className="flex flex-wrap gap-2">
        {VIEWS.map((v) => (
          <Button key={v.id} variant={view === v.id ? 'primary' : 'secondary'} aria-pressed={view === v.id} onClick={() => choose(v.id)}>
            {v.label}
          </Button>
        ))}
      </div>
      {!built.ok ? (
        <Alert tone="error" title="The hull cannot be drawn from the table yet">
          <p>Put these right on the Lines screen first:</p>
          <ul className="list-disc pl-6">
            {built.issues.slice(0, 8).map((issue, i) => (
              <li key={`${issue.code}-${i}`}>{issue.message}</li>
            ))}
          </ul>
          {built.issues.length > 8 && <p>… and {built.issues.length - 8} more.</p>}
        </Alert>
      ) : view === 'body-plan' ? (
        <div className="grid grid-cols-1 gap-4 xl:grid-cols-[minmax(0,1fr)_24rem]">
          <BodyPlanView plan={plan} hull={built.hull} readOnly={!canEditLines} notation={notation} selection={selection} onSelect={setPicked} onEdit={onEdit} cellFlags={check.cellFlags} />
          {selection && <StationOffsetsPanel selection={selection} onSelect={setPicked} section={selectedSection} readOnly={!canEditLines} notation={notation} />}
        </div>
      ) : view === 'fairing' ? (
        <FairingView plan={plan} hull={built.hull} readOnly={!canEditLines} notation={notation} />
      ) : view === 'part' ? (
        <PartView plan={plan} hull={built.hull} readOnly={!canEditParts} notation={notation} partId={partId} />
      ) : (
        <MeasuredFrameView plan={plan} hull={built.hull} readOnly={!canEditParts} notation={notation} partId={partId} />
      )}
      {view === 'body-plan' && built.ok && (
        <p className="flex items-center gap-2 text-muted">
          <Eye aria-hidden="true" className="size-5" />
          Forward sections are drawn right of the centreline, aft sections left; the midship section on both. Squares mark knuckles, triangles the offsets the fairness check flags.
        </p>
      )}
    </div>
  );
}
