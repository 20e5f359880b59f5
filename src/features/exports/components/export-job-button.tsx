import { useEffect, useRef, useState, type ReactNode } from 'react';
import { Download } from 'lucide-react';
import type { ExportJobStart } from '../../../../shared/api/exports';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { describeError } from '../../../lib/api-client';
import { exportJobFileHref, useExportJob } from '../api/get-export-job';
import { useStartExportJob } from '../api/start-export-job';

/** Progress is shown only for exports still running after this long (ms): a quick one just downloads. */
export const PROGRESS_AFTER_MS = 1000;

/** Hands the finished file to the browser's own download, as a link with `download` would. */
function downloadFile(href: string): void {
  const a = document.createElement('a');
  a.href = href;
  a.download = '';
  a.rel = 'noopener';
  document.body.append(a);
  a.click();
  a.remove();
}

/**
 * A download that the server makes in the background (a big tiled PDF, the zip): pressing it starts the
 * export job; after a second still running, a bar shows the pages or files made so far; once made, the
 * file downloads, and a link stays to download it again.
 */
export function ExportJobButton({ hullId, start, children, disabled = false }: { hullId: number; start: ExportJobStart; children: ReactNode; disabled?: boolean }) {
  const starter = useStartExportJob(hullId);
  const [jobId, setJobId] = useState<string | null>(null);
  const [slow, setSlow] = useState(false);
  const job = useExportJob(hullId, jobId);
  const status = job.data?.job;
  const downloaded = useRef<string | null>(null);

  useEffect(() => {
    if (!jobId) return;
    const timer = setTimeout(() => setSlow(true), PROGRESS_AFTER_MS);
    return () => clearTimeout(timer);
  }, [jobId]);

  useEffect(() => {
    if (status?.state === 'done' && jobId && downloaded.current !== jobId) {
      downloaded.current = jobId;
      downloadFile(exportJobFileHref(hullId, jobId));
    }
  }, [status?.state, jobId, hullId]);

  // A job the server lost (a restart forgets jobs in memory) is not running any more: the button is free to start it again.
  const running = starter.isPending || (jobId !== null && !job.isError && (!status || status.state === 'running'));
  const begin = () => {
    setSlow(false);
    setJobId(null);
    starter.mutate(start, { onSuccess: ({ job: started }) => setJobId(started.id) });
  };

  return (
    <div className="flex flex-col gap-2">
      <Button variant="secondary" onClick={begin} busy={running} disabled={disabled}>
        <Download aria-hidden="true" className="size-5" />
        {children}
      </Button>
      {running && slow && status && (
        <div role="status" className="flex flex-col gap-1">
          <label className="text-sm font-semibold">
            Making {status.fileName}: {status.done} of {status.total} {status.unit}
            <progress className="mt-1 block h-3 w-full" value={status.done} max={Math.max(status.total, 1)} />
          </label>
        </div>
      )}
      {status?.state === 'done' && jobId && (
        <p role="status" className="text-sm text-muted">
          Made {status.fileName} ({formatBytes(status.bytes ?? 0)}).{' '}
          <a className="font-semibold text-primary underline" href={exportJobFileHref(hullId, jobId)} download>
            Download it again
          </a>
        </p>
      )}
      {status?.state === 'failed' && <Alert tone="error" title="The file could not be made">{status.error?.message}</Alert>}
      {starter.isError && <Alert tone="error" title="The file could not be made">{describeError(starter.error)}</Alert>}
      {job.isError && <Alert tone="error" title="Lost track of the file">{describeError(job.error)}</Alert>}
    </div>
  );
}

/** Bytes in the unit a person reads: B, kB or MB (1 kB = 1000 B, as file managers now show, SI). */
export function formatBytes(bytes: number): string {
  if (bytes < 1000) return `${bytes} B`;
  if (bytes < 1e6) return `${(bytes / 1000).toFixed(1)} kB`;
  return `${(bytes / 1e6).toFixed(2)} MB`;
}
