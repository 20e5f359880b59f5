import { TriangleAlert } from 'lucide-react';
import { buildStages, layerStages, type BuildBoardResponse, type BuildPartState, type BuildStage } from '../../../../shared/api/build-log';
import { Alert } from '../../../components/ui/alert';
import { flagWhere, layerLabel, stageLabels } from './build-words';

const chipDone = 'rounded px-2 py-0.5 text-sm bg-primary text-white';
const chipPart = 'rounded px-2 py-0.5 text-sm border-2 border-primary text-primary-strong';
const chipLeft = 'rounded px-2 py-0.5 text-sm border border-rule text-muted';

/** A stage chip: done, done on some layers of a laminated part ("Cut 1/2"), or still to do. */
function StageChip({ part, stage }: { part: BuildPartState; stage: BuildStage }) {
  if (part.done.includes(stage)) return <span className={chipDone}>✓ {stageLabels[stage]}</span>;
  const layersDone = part.layers.filter((l) => l.done.includes(stage)).length;
  if (layersDone > 0) {
    return (
      <span className={chipPart}>
        {stageLabels[stage]} {layersDone}/{part.layers.length} layers
      </span>
    );
  }
  return <span className={chipLeft}>{stageLabels[stage]}</span>;
}

/** How many parts (and, for the layer stages, how many layers of all parts) have each stage done. */
function StageTally({ parts }: { parts: BuildPartState[] }) {
  const layerCount = parts.reduce((n, p) => n + Math.max(1, p.layers.length), 0);
  const laminated = parts.some((p) => p.layers.length > 0);
  return (
    <ul aria-label="Parts done at each stage" className="flex flex-wrap gap-2">
      {buildStages.map((s) => {
        const partsDone = parts.filter((p) => p.done.includes(s)).length;
        const layersDone = parts.reduce((n, p) => n + (p.layers.length > 0 ? p.layers.filter((l) => l.done.includes(s)).length : p.done.includes(s) ? 1 : 0), 0);
        return (
          <li key={s} className={`rounded-lg border-2 px-3 py-1 ${partsDone === parts.length ? 'border-primary bg-primary-soft' : 'border-rule bg-surface'}`}>
            <span className="font-semibold">{stageLabels[s]}</span>{' '}
            <span className="tabular-nums">
              {partsDone} of {parts.length}
            </span>
            {laminated && layerStages.includes(s) && (
              <span className="text-sm text-muted tabular-nums">
                {' '}
                · layers {layersDone} of {layerCount}
              </span>
            )}
          </li>
        );
      })}
    </ul>
  );
}

/** The whole hull at a glance: each part's stages (layer by layer where laminated), what is next, what is flagged, and the material so far. */
export function BuildBoard({ board, selected, onSelect }: { board: BuildBoardResponse; selected: string | null; onSelect: (partId: string) => void }) {
  const left = board.parts.filter((p) => p.next !== null).length;
  const flagged = board.parts.filter((p) => p.flag !== null);
  const { estimate, used } = board.material;
  const rows = [
    { label: 'Ply sheets (1220 × 2440)', used: used.plySheets, estimate: estimate.plySheets },
    { label: 'Epoxy for tape and cloth (ml)', used: used.epoxyMl, estimate: estimate.epoxyMl },
    { label: 'Fillet mix (ml)', used: used.fillerMl, estimate: estimate.fillerMl },
    { label: 'Glass tape (m)', used: used.tapeM, estimate: estimate.tapeM },
  ];
  return (
    <div className="flex flex-col gap-4">
      <p className="text-lg">
        <strong>{left}</strong> of {board.parts.length} parts still have work to do.
      </p>
      <StageTally parts={board.parts} />
      {flagged.length > 0 && (
        <Alert tone="caution" title={`${flagged.length} cut part${flagged.length === 1 ? '' : 's'} moved in a later revision`}>
          {flagged.map((p) => `${p.name}${flagWhere(p.flag!)}: ${p.flag!.movedMm} mm`).join('; ')} (more than {board.moveToleranceMm} mm). Check them against the new patterns before going on.
        </Alert>
      )}
      <ul aria-label="Parts by stage" className="grid gap-3 md:grid-cols-2">
        {board.parts.map((p) => (
          <li key={p.partId}>
            <button
              type="button"
              onClick={() => onSelect(p.partId)}
              aria-pressed={selected === p.partId}
              className={`flex min-h-12 w-full flex-col gap-2 rounded-xl border-2 p-4 text-left ${p.flag ? 'border-danger' : selected === p.partId ? 'border-primary' : 'border-rule'} ${selected === p.partId ? 'bg-primary-soft' : 'bg-surface'}`}
            >
              <span className="flex flex-wrap items-center justify-between gap-2 text-lg font-semibold">
                <span>
                  {p.name}
                  {p.layers.length > 0 && <span className="text-sm font-normal text-muted"> · {p.layers.length} layers</span>}
                </span>
                {p.flag && (
                  <span className="inline-flex items-center gap-1 text-sm text-danger">
                    <TriangleAlert aria-hidden="true" className="size-4" /> Moved {p.flag.movedMm} mm
                  </span>
                )}
              </span>
              {/* Everything inside a button is read as its name, so these spans carry no labels of their own. */}
              <span className="flex flex-wrap gap-1">
                {buildStages.map((s) => (
                  <StageChip key={s} part={p} stage={s} />
                ))}
              </span>
              {p.layers.length > 0 && (
                <span className="flex flex-col gap-1">
                  {p.layers.map((l) => (
                    <span key={l.index} className="flex flex-wrap items-center gap-1 text-sm">
                      <span className="min-w-28 font-semibold">{layerLabel(l)}</span>
                      {layerStages.map((s) => (
                        <span key={s} className={l.done.includes(s) ? chipDone : chipLeft}>
                          {l.done.includes(s) ? '✓ ' : ''}
                          {stageLabels[s]}
                        </span>
                      ))}
                      {l.flag && <span className="text-danger">moved {l.flag.movedMm} mm</span>}
                    </span>
                  ))}
                </span>
              )}
              <span className="text-sm text-muted">
                {p.next ? `Next: ${stageLabels[p.next]}` : 'All stages done'}
                {p.photos > 0 ? ` · ${p.photos} photo${p.photos === 1 ? '' : 's'}` : ''}
              </span>
            </button>
          </li>
        ))}
      </ul>
      <table className="w-full max-w-xl text-left">
        <caption className="text-left font-semibold">Material used so far, against the cut list's estimate</caption>
        <thead>
          <tr>
            <th className="py-1">Material</th>
            <th className="py-1 text-right">Used</th>
            <th className="py-1 text-right">Estimate</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.label} className="border-t border-rule">
              <td className="py-1">{r.label}</td>
              <td className="py-1 text-right tabular-nums">{Math.round(r.used * 10) / 10}</td>
              <td className="py-1 text-right tabular-nums">{r.estimate}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
