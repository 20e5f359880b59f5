import { useState } from 'react';
import { Link } from 'react-router-dom';
import { buildStages, epoxyStages, sawStages, type BuildStage } from '../../../../shared/api/build-log';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Loading } from '../../../components/ui/loading';
import { describeError } from '../../../lib/api-client';
import { formatWhen } from '../../../lib/labels';
import { useAddBuildEvent } from '../api/add-build-event';
import { useBuildPart } from '../api/get-build-part';
import { photoUrl, useUploadBuildPhotos } from '../api/upload-build-photos';
import { epoxyCaution, sawCaution, stageLabels } from './build-words';

const input = 'min-h-12 rounded-lg border-2 border-edge bg-surface px-3 text-lg';

/** One part at the bench: a big button for the next stage, a note, material used, photos, and the history. */
export function PartPanel({ hullId, partId, canKeep }: { hullId: number; partId: string; canKeep: boolean }) {
  const part = useBuildPart(hullId, partId);
  const addEvent = useAddBuildEvent(hullId);
  const upload = useUploadBuildPhotos(hullId);
  const [note, setNote] = useState('');
  const [used, setUsed] = useState({ plySheets: '', epoxyMl: '', fillerMl: '', tapeM: '' });
  const [error, setError] = useState<string | null>(null);

  if (part.isPending) return <Loading label="Loading the part…" />;
  if (part.isError) return <Alert tone="error">{describeError(part.error)}</Alert>;
  const { state, events, photos } = part.data;
  const next = state.next;
  const lastDone = [...buildStages].reverse().find((s) => state.done.includes(s)) ?? null;

  const send = async (stage: BuildStage, action: 'done' | 'reopened') => {
    setError(null);
    const amounts = Object.fromEntries(Object.entries(used).filter(([, v]) => v.trim() !== '').map(([k, v]) => [k, Number(v)]));
    try {
      await addEvent.mutateAsync({ partId, stage, action, note, used: amounts });
      setNote('');
      setUsed({ plySheets: '', epoxyMl: '', fillerMl: '', tapeM: '' });
    } catch (err) {
      setError(describeError(err));
    }
  };

  const onFiles = async (files: FileList | null) => {
    if (!files || files.length === 0) return;
    setError(null);
    try {
      await upload.mutateAsync({ partId, stage: lastDone, files: [...files] });
    } catch (err) {
      setError(describeError(err));
    }
  };

  return (
    <section aria-labelledby="part-panel-heading" className="flex flex-col gap-4 rounded-xl border-2 border-rule bg-surface p-4">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 id="part-panel-heading" className="text-xl font-bold">
          {state.name}
        </h3>
        <Link to={`/hulls/${hullId}/build-log/${encodeURIComponent(partId)}/sheet`} className="font-semibold text-primary underline underline-offset-4">
          Build sheet to print
        </Link>
      </div>
      {state.flag && (
        <Alert tone="caution" title={`Moved ${state.flag.movedMm} mm since it was cut`}>
          It was cut from revision {state.flag.cutRevisionId}; the latest revision moves its outline. Check it against the new pattern.
        </Alert>
      )}
      {next && epoxyStages.includes(next) && <Alert tone="caution">{epoxyCaution}</Alert>}
      {next && sawStages.includes(next) && <Alert tone="caution">{sawCaution}</Alert>}
      {canKeep && (
        <div className="flex flex-col gap-3">
          <label className="flex flex-col gap-1">
            <span className="font-semibold">Note (optional)</span>
            <textarea value={note} onChange={(e) => setNote(e.target.value)} rows={2} className={`${input} py-2`} placeholder="e.g. measured 3 mm over at the sheer; trimmed to the line" />
          </label>
          <fieldset className="grid grid-cols-2 gap-2 sm:grid-cols-4">
            <legend className="font-semibold">Material used at this stage (optional)</legend>
            {(
              [
                ['plySheets', 'Ply sheets'],
                ['epoxyMl', 'Epoxy (ml)'],
                ['fillerMl', 'Fillet mix (ml)'],
                ['tapeM', 'Glass tape (m)'],
              ] as const
            ).map(([key, label]) => (
              <label key={key} className="flex flex-col gap-1">
                <span>{label}</span>
                <input type="number" inputMode="decimal" min={0} step="any" value={used[key]} onChange={(e) => setUsed({ ...used, [key]: e.target.value })} className={input} />
              </label>
            ))}
          </fieldset>
          <div className="flex flex-wrap gap-3">
            {next && (
              <Button className="min-h-16 px-8 text-xl" busy={addEvent.isPending} onClick={() => void send(next, 'done')}>
                Mark {stageLabels[next].toLowerCase()}
              </Button>
            )}
            {lastDone && (
              <Button variant="secondary" className="min-h-16 px-6 text-lg" disabled={addEvent.isPending} onClick={() => void send(lastDone, 'reopened')}>
                Reopen {stageLabels[lastDone].toLowerCase()}
              </Button>
            )}
            <label className="inline-flex min-h-16 cursor-pointer items-center rounded-lg border-2 border-edge bg-surface px-6 text-lg font-semibold">
              {upload.isPending ? 'Uploading…' : 'Add a photo'}
              <input type="file" accept="image/*" capture="environment" multiple className="sr-only" onChange={(e) => void onFiles(e.target.files)} />
            </label>
          </div>
          {error && <Alert tone="error">{error}</Alert>}
        </div>
      )}
      {photos.length > 0 && (
        <ul aria-label="Photos" className="flex flex-wrap gap-2">
          {photos.map((p) => (
            <li key={p.id}>
              <a href={photoUrl(hullId, p.id, 'full')} target="_blank" rel="noreferrer">
                <img src={photoUrl(hullId, p.id, 'thumb')} width={p.thumbWidth} height={p.thumbHeight} alt={`${state.name}${p.stage ? `, ${stageLabels[p.stage].toLowerCase()}` : ''}, by ${p.uploader.displayName}`} className="h-32 w-auto rounded border border-rule" />
              </a>
            </li>
          ))}
        </ul>
      )}
      <div>
        <h4 className="font-semibold">History</h4>
        {events.length === 0 ? (
          <p className="text-muted">Nothing marked yet.</p>
        ) : (
          <ol className="flex flex-col gap-1">
            {[...events].reverse().map((e) => (
              <li key={e.id}>
                <strong>{e.action === 'done' ? stageLabels[e.stage] : `${stageLabels[e.stage]} reopened`}</strong>
                {e.layerIndex !== null ? ` (layer ${e.layerIndex + 1})` : ''} by {e.author.displayName}, {formatWhen(e.createdAt)}
                {e.stage === 'cut' && e.action === 'done' && e.revisionId !== null ? `, from revision ${e.revisionId}` : ''}
                {e.note && <span className="block text-muted">{e.note}</span>}
              </li>
            ))}
          </ol>
        )}
      </div>
    </section>
  );
}
