import { Download } from 'lucide-react';
import type { ExportIndexEntry } from '../../../../shared/api/exports';
import { Alert } from '../../../components/ui/alert';
import { buttonClasses } from '../../../components/ui/button';
import { Loading } from '../../../components/ui/loading';
import { describeError } from '../../../lib/api-client';
import { useExportIndex } from '../api/get-export-index';
import { CalibrationCaution } from './calibration-caution';
import { ExportJobButton, formatBytes } from './export-job-button';

/** The row's download: a plain link for a quick file; an export job (with progress) for the tiles and the zip. */
function DownloadOf({ hullId, entry }: { hullId: number; entry: ExportIndexEntry }) {
  if (entry.problem) return <p className="text-danger">Cannot be made: {entry.problem}</p>;
  if (entry.kind === 'zip') return <ExportJobButton hullId={hullId} start={{ kind: 'zip' }}>Download</ExportJobButton>;
  if (entry.kind === 'tiled-pdf' && entry.partId) {
    return (
      <ExportJobButton hullId={hullId} start={{ kind: 'tiled-pdf', partId: entry.partId, query: { layer: entry.layer } }}>
        Download
      </ExportJobButton>
    );
  }
  return (
    <a className={buttonClasses('secondary')} href={entry.href} download aria-label={`Download ${entry.label}`}>
      <Download aria-hidden="true" className="size-5" />
      Download
    </a>
  );
}

/** Every file the hull exports, from the latest revision, with its size; the Print shop makes the other papers and sizes. */
export function DownloadsScreen({ hullId }: { hullId: number }) {
  const index = useExportIndex(hullId);
  if (index.isPending) return <Loading label="Making every file once to measure it (a few seconds the first time for each revision)…" />;
  if (index.isError) return <Alert tone="error" title="The downloads could not be listed">{describeError(index.error)}</Alert>;
  const { exports, revisionId } = index.data;
  return (
    <div className="flex flex-col gap-4">
      <CalibrationCaution />
      <p className="text-muted">Every file is made from revision {revisionId}, the latest saved. Tiled PDFs here are A4 portrait; the Print shop makes other papers, roll widths and inch files.</p>
      <div className="overflow-x-auto">
        <table className="w-full border-collapse text-left">
          <caption className="sr-only">Exports of this hull</caption>
          <thead>
            <tr className="border-b-2 border-edge">
              <th scope="col" className="py-2 pr-4">What</th>
              <th scope="col" className="py-2 pr-4">File</th>
              <th scope="col" className="py-2 pr-4">Revision</th>
              <th scope="col" className="py-2 pr-4 text-right">Size</th>
              <th scope="col" className="py-2">
                <span className="sr-only">Download</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {exports.map((e) => (
              <tr key={e.href} className="border-b border-rule align-top">
                <th scope="row" className="py-2 pr-4 font-semibold">{e.label}</th>
                <td className="break-all py-2 pr-4 font-mono text-sm">{e.name ?? '—'}</td>
                <td className="py-2 pr-4">{e.revisionId}</td>
                <td className="whitespace-nowrap py-2 pr-4 text-right tabular-nums">{e.bytes === null ? '—' : formatBytes(e.bytes)}</td>
                <td className="py-2">
                  <DownloadOf hullId={hullId} entry={e} />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
