import { memo, useId, useMemo, useState } from 'react';
import { Eye, Keyboard } from 'lucide-react';
import type { LengthUnit, Notation } from '../../../../../shared/geometry/notation-schema';
import { Alert } from '../../../../components/ui/alert';
import { Card } from '../../../../components/ui/card';
import { notationIn } from '../../format';
import { useLinesCheck } from '../../hooks/use-lines-check';
import { useEditor, usePlanEditor } from '../../hooks/use-plan-editor';
import { ChecksPanel } from './checks-panel';
import { DownloadsLinks } from './downloads-links';
import { ImportOffsetsForm, ImportPlanJsonForm } from './import-offsets-form';
import { LinesPanel } from './lines-panel';
import { LinesSettingsForm } from './lines-settings-form';
import { OffsetsGrid } from './offsets-grid';
import { StationsPanel } from './stations-panel';

const unitWords: Record<LengthUnit, string> = { mm: 'Millimetres', in: 'Inches', ftin: 'Feet-inches-eighths' };

/** Show and type lengths in millimetres or feet-inches-eighths on this screen; the hull's own units stay as they are. */
function UnitSwitch({ value, onChange, hullUnit }: { value: LengthUnit; onChange: (unit: LengthUnit) => void; hullUnit: LengthUnit }) {
  const name = useId();
  const choices: LengthUnit[] = hullUnit === 'in' ? ['mm', 'in', 'ftin'] : ['mm', 'ftin'];
  return (
    <fieldset className="flex flex-wrap items-center gap-2">
      <legend className="sr-only">Show and type lengths in</legend>
      <span aria-hidden="true" className="font-semibold">
        Show and type in
      </span>
      {choices.map((unit) => (
        <label key={unit} className="flex min-h-12 cursor-pointer items-center gap-2 rounded-lg border-2 border-edge bg-surface px-3 has-checked:border-primary has-checked:bg-primary has-checked:text-white">
          <input type="radio" name={name} value={unit} checked={value === unit} onChange={() => onChange(unit)} className="size-5" />
          {unitWords[unit]}
        </label>
      ))}
    </fieldset>
  );
}

/** The table and its checks: the only part of the screen that follows every change of a cell. */
function TableWithChecks({ notation, readOnly, onMessage }: { notation: Notation; readOnly: boolean; onMessage: (message: string | null) => void }) {
  const lines = useEditor((s) => s.plan.lines);
  const check = useLinesCheck(lines);
  return (
    <>
      <OffsetsGrid notation={notation} readOnly={readOnly} check={check} onMessage={onMessage} />
      <ChecksPanel check={check} notation={notation} />
    </>
  );
}

const Rest = memo(function Rest({ notation, readOnly, hullId, hasRevision }: { notation: Notation; readOnly: boolean; hullId: number; hasRevision: boolean }) {
  return (
    <>
      {!readOnly && (
        <div className="grid grid-cols-1 gap-6 xl:grid-cols-2">
          <StationsPanel notation={notation} />
          <LinesPanel notation={notation} />
        </div>
      )}
      <Card>
        <LinesSettingsForm readOnly={readOnly} />
      </Card>
      <Card className="flex flex-col gap-8">
        {!readOnly && <ImportOffsetsForm />}
        {!readOnly && <ImportPlanJsonForm />}
        <DownloadsLinks hullId={hullId} hasRevision={hasRevision} />
      </Card>
    </>
  );
});

/** The Lines screen: the table of offsets, its checks, its stations and lines, its settings, import and downloads. */
export function LinesScreen() {
  const { hull, canEditLines } = usePlanEditor();
  // Only what the whole screen needs: a change of one cell must not redraw the station list or the forms.
  const hullNotation = useEditor((s) => s.plan.lines.notation);
  const hasRevision = useEditor((s) => s.baseRevisionId !== null);
  const [viewUnit, setViewUnit] = useState<LengthUnit>(hullNotation.unit);
  const [message, setMessage] = useState<string | null>(null);
  const notation = useMemo(() => notationIn(hullNotation, viewUnit), [hullNotation, viewUnit]);
  const readOnly = !canEditLines;

  return (
    <div className="flex flex-col gap-6">
      <title>{`Lines · ${hull.name} · Loftbench`}</title>
      <div className="flex flex-col gap-2">
        <h2 className="text-2xl font-bold">Lines</h2>
        {readOnly ? (
          <Alert tone="info" title="Read only">
            As a helper on this hull you can read the lines and the fairness check, and download the table, but not change them.
          </Alert>
        ) : (
          <p className="flex max-w-prose items-start gap-2 text-muted">
            <Keyboard aria-hidden="true" className="mt-0.5 size-5 shrink-0" />
            <span>
              Stations across, lines down. Type into a cell or tap it twice; Enter saves and goes down, Tab goes right, Escape puts the cell back. Paste a block copied from a spreadsheet
              into the active cell. Ctrl+Z undoes.
            </span>
          </p>
        )}
      </div>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <UnitSwitch value={viewUnit} onChange={setViewUnit} hullUnit={hullNotation.unit} />
        {viewUnit !== hullNotation.unit && (
          <p className="flex items-center gap-2 text-muted">
            <Eye aria-hidden="true" className="size-5" />
            Shown in {unitWords[viewUnit].toLowerCase()}; the hull is written in {unitWords[hullNotation.unit].toLowerCase()}.
          </p>
        )}
      </div>
      {message && <Alert tone="caution">{message}</Alert>}
      <TableWithChecks notation={notation} readOnly={readOnly} onMessage={setMessage} />
      <Rest notation={notation} readOnly={readOnly} hullId={hull.id} hasRevision={hasRevision} />
    </div>
  );
}
