import { useState } from 'react';
import { ArrowDown, ArrowLeft, ArrowRight, ArrowUp, RotateCw } from 'lucide-react';
import type { ArrangementResponse } from '../../../../shared/api/exports';
import { type SheetLayout, type SheetLayoutPlacement, sheetLayoutIssues, sheetLayoutMoveIssues, sheetLayoutNewSheetFor, sheetLayoutWith } from '../../../../shared/geometry/sheet-layout';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { SelectField } from '../../../components/ui/field';
import { Loading } from '../../../components/ui/loading';
import { describeError } from '../../../lib/api-client';
import { useArrangement } from '../api/get-arrangement';
import { useResetArrangement } from '../api/reset-arrangement';
import { useSaveArrangement } from '../api/save-arrangement';
import { SheetView } from './sheet-view';

const STEPS_MM = [1, 10, 100] as const;
/** The Sheet choice that starts a new sheet for the piece. */
const NEW_SHEET = 'new';

/**
 * The cut list's pieces on plywood sheets, as the cut list PDF and CSV will print them. Owner and
 * builder move a piece by dragging it (or with the buttons), turn it a quarter turn, or send it to
 * another sheet or a new one; every move is checked at once with the same rules the server checks a save with
 * (kerf between pieces, inside the sheet, grain, ply), and a move that breaks one is refused, saying which.
 */
export function CutListSheets({ hullId, canArrange }: { hullId: number; canArrange: boolean }) {
  const arrangement = useArrangement(hullId);
  return (
    <section aria-labelledby="cut-list-heading" className="flex flex-col gap-4">
      <h3 id="cut-list-heading" className="text-xl font-semibold">
        Cut list: pieces on plywood sheets
      </h3>
      {arrangement.isPending && <Loading label="Arranging the pieces…" />}
      {arrangement.isError && <Alert tone="error" title="The cut list could not be arranged">{describeError(arrangement.error)}</Alert>}
      {arrangement.data && <SheetEditor key={arrangement.data.revisionId} hullId={hullId} data={arrangement.data} canArrange={canArrange} />}
    </section>
  );
}

function SheetEditor({ hullId, data, canArrange }: { hullId: number; data: ArrangementResponse; canArrange: boolean }) {
  const save = useSaveArrangement(hullId);
  const reset = useResetArrangement(hullId);
  const [layout, setLayout] = useState<SheetLayout>(data.layout);
  const [dirty, setDirty] = useState(false);
  const [selectedId, setSelected] = useState<string | null>(null);
  const [refusal, setRefusal] = useState<string | null>(null);
  const [dragFlag, setDragFlag] = useState<string | null>(null);
  const [step, setStep] = useState<number>(10);
  const pieces = data.pieces;
  const byId = new Map(pieces.map((p) => [p.id, p]));
  const selected = layout.placements.find((p) => p.pieceId === selectedId) ?? null;
  const standing = new Set(sheetLayoutIssues(layout, pieces).map((i) => i.pieceId));
  const flagged = dragFlag ? new Set([...standing, dragFlag]) : standing;

  // `base`: the arrangement the move starts from, when it is not the one shown (a new sheet added for it).
  const move = (placement: SheetLayoutPlacement, base: SheetLayout = layout): boolean => {
    setDragFlag(null);
    const issues = sheetLayoutMoveIssues(base, pieces, placement);
    if (issues.length) {
      setRefusal(issues[0]!.message);
      return false;
    }
    setLayout(sheetLayoutWith(base, placement));
    setDirty(true);
    setRefusal(null);
    save.reset();
    return true;
  };
  const dragTo = (placement: SheetLayoutPlacement) => setDragFlag(sheetLayoutMoveIssues(layout, pieces, placement).length ? placement.pieceId : null);
  const nudge = (dx: number, dy: number) => selected && move({ ...selected, x: selected.x + dx, y: selected.y + dy });
  const piece = selected ? byId.get(selected.pieceId) : undefined;
  const sameplySheets = piece ? layout.sheets.filter((s) => s.plyThicknessMm === piece.plyThicknessMm) : [];
  const toSheet = (value: string) => {
    if (!selected || !piece) return;
    if (value !== NEW_SHEET) return void move({ ...selected, sheetNo: Number(value) });
    const grown = sheetLayoutNewSheetFor(layout, piece, selected.rotated);
    move(grown.placement, grown.layout);
  };

  return (
    <div className="flex flex-col gap-4">
      <p className="text-muted">
        {data.byHand ? `Arranged by hand, saved ${new Date(data.savedAt!).toLocaleString()}.` : 'Arranged automatically by the packer.'} {data.note}{' '}
        Sheets {layout.sheet.widthMm} x {layout.sheet.lengthMm} mm, at least {layout.kerfMm} mm saw kerf between pieces. Pieces are placed by their boxes (dashed).
        {!canArrange && ' Only the owner and builders change the arrangement.'}
      </p>
      {refusal && (
        <Alert tone="error" title="That move is refused">
          {refusal}
        </Alert>
      )}
      <div className="rounded-lg border-2 border-edge bg-surface p-2" role="img" aria-label={`Plywood sheets: ${layout.sheets.length} sheets with ${layout.placements.length} pieces`}>
        <SheetView layout={layout} pieces={pieces} selectedId={selectedId} flagged={flagged} editable={canArrange} onSelect={setSelected} onDragTo={dragTo} onDrop={move} />
      </div>
      <div className="flex flex-wrap items-end gap-3">
        <SelectField label="Piece" value={selectedId ?? ''} onChange={(e) => setSelected(e.target.value || null)}>
          <option value="">Choose a piece…</option>
          {layout.placements.map((pl) => (
            <option key={pl.pieceId} value={pl.pieceId}>
              {pl.pieceId} (sheet {pl.sheetNo})
            </option>
          ))}
        </SelectField>
        {canArrange && selected && piece && (
          <>
            <SelectField label="Step" value={String(step)} onChange={(e) => setStep(Number(e.target.value))}>
              {STEPS_MM.map((s) => (
                <option key={s} value={s}>
                  {s} mm
                </option>
              ))}
            </SelectField>
            <Button variant="secondary" aria-label={`Move left ${step} mm`} onClick={() => nudge(-step, 0)}>
              <ArrowLeft aria-hidden="true" className="size-5" />
            </Button>
            <Button variant="secondary" aria-label={`Move right ${step} mm`} onClick={() => nudge(step, 0)}>
              <ArrowRight aria-hidden="true" className="size-5" />
            </Button>
            <Button variant="secondary" aria-label={`Move up the sheet ${step} mm`} onClick={() => nudge(0, step)}>
              <ArrowUp aria-hidden="true" className="size-5" />
            </Button>
            <Button variant="secondary" aria-label={`Move down the sheet ${step} mm`} onClick={() => nudge(0, -step)}>
              <ArrowDown aria-hidden="true" className="size-5" />
            </Button>
            <Button variant="secondary" onClick={() => move({ ...selected, rotated: !selected.rotated })}>
              <RotateCw aria-hidden="true" className="size-5" />
              Turn 90°
            </Button>
            <SelectField label="Sheet" value={String(selected.sheetNo)} onChange={(e) => toSheet(e.target.value)}>
              {sameplySheets.map((s) => (
                <option key={s.sheetNo} value={s.sheetNo}>
                  Sheet {s.sheetNo}
                </option>
              ))}
              <option value={NEW_SHEET}>A new sheet ({piece.plyThicknessMm} mm)</option>
            </SelectField>
          </>
        )}
      </div>
      {selected && (
        <p className="text-sm text-muted" aria-live="polite">
          {selected.pieceId}: sheet {selected.sheetNo}, box corner at {selected.x} mm across, {selected.y} mm along{selected.rotated ? ', turned' : ''}.
        </p>
      )}
      {canArrange && (
        <div className="flex flex-wrap items-center gap-3">
          <Button disabled={!dirty} busy={save.isPending} onClick={() =>
              save.mutate(
                { revisionId: data.revisionId, layout },
                {
                  onSuccess: (saved) => {
                    setLayout(saved.layout);
                    setDirty(false);
                  },
                },
              )
            }>
            Save the arrangement
          </Button>
          {data.byHand && (
            <Button variant="quiet" busy={reset.isPending} onClick={() =>
                reset.mutate(undefined, {
                  onSuccess: (fresh) => {
                    setLayout(fresh.layout);
                    setDirty(false);
                    save.reset();
                  },
                })
              }>
              Go back to the automatic arrangement
            </Button>
          )}
          {dirty && <span className="font-semibold text-caution">Moved, not saved yet</span>}
          {save.isSuccess && !dirty && (
            <span role="status" className="font-semibold text-ok">
              Arrangement saved: the cut list PDF and CSV use it.
            </span>
          )}
        </div>
      )}
      {save.isError && <Alert tone="error" title="The arrangement was not saved">{describeError(save.error)}</Alert>}
      {reset.isError && <Alert tone="error" title="Could not go back">{describeError(reset.error)}</Alert>}
    </div>
  );
}
