import { layerStages, type BuildLayerState, type BuildStage } from '../../../../shared/api/build-log';
import { Button } from '../../../components/ui/button';
import { layerLabel, stageLabels } from './build-words';

/**
 * The layer stages of a laminated part, one row per layer: each lamination is patterned and cut on its
 * own (see `layerStages`), so each row has its own Mark and Reopen.
 */
export function LayerMarks({ layers, busy, canKeep, onMark }: { layers: BuildLayerState[]; busy: boolean; canKeep: boolean; onMark: (layerIndex: number, stage: BuildStage, action: 'done' | 'reopened') => void }) {
  return (
    <fieldset className="flex flex-col gap-2">
      <legend className="font-semibold">Layers: patterned and cut one at a time, then laminated together</legend>
      {layers.map((l) => {
        const last = [...layerStages].reverse().find((s) => l.done.includes(s)) ?? null;
        return (
          <div key={l.index} className="flex flex-wrap items-center gap-3 border-t border-rule pt-2">
            <span className="min-w-32 font-semibold">{layerLabel(l)}</span>
            <span className="text-muted">{l.done.length > 0 ? l.done.map((s) => `✓ ${stageLabels[s]}`).join('  ') : 'Nothing yet'}</span>
            {l.flag && <span className="font-semibold text-danger">Moved {l.flag.movedMm} mm since it was cut</span>}
            {canKeep && (
              <span className="ml-auto flex flex-wrap gap-2">
                {l.next && (
                  <Button className="min-h-14 px-6 text-lg" disabled={busy} onClick={() => onMark(l.index, l.next!, 'done')}>
                    Mark layer {l.index + 1} {stageLabels[l.next].toLowerCase()}
                  </Button>
                )}
                {last && (
                  <Button variant="secondary" className="min-h-14" disabled={busy} onClick={() => onMark(l.index, last, 'reopened')}>
                    Reopen layer {l.index + 1} {stageLabels[last].toLowerCase()}
                  </Button>
                )}
              </span>
            )}
          </div>
        );
      })}
    </fieldset>
  );
}
