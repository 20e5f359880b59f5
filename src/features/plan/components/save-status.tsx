import { CircleAlert, CircleCheck, CloudOff, LoaderCircle, PencilLine } from 'lucide-react';
import { formatWhen } from '../../../lib/labels';
import type { SaveStatus } from '../editor/editor-store';
import { useEditor, usePlanEditor } from '../hooks/use-plan-editor';

function words(status: SaveStatus): { text: string; detail?: string; tone: 'ok' | 'busy' | 'warn' | 'bad' | 'quiet' } {
  switch (status.state) {
    case 'clean':
      return { text: 'Nothing saved yet', tone: 'quiet' };
    case 'unsaved':
      return { text: 'Changes not saved yet', tone: 'busy' };
    case 'saving':
      return { text: 'Saving…', tone: 'busy' };
    case 'draft-saved':
      return { text: 'Draft saved', detail: `Your changes are kept on the server as a draft (${formatWhen(status.at)}); save a revision when they are ready.`, tone: 'ok' };
    case 'revision-saved':
      return { text: `Revision ${status.revisionId} saved`, tone: 'ok' };
    case 'offline':
      return { text: 'Offline — changes kept in this tab', detail: 'They are sent as soon as the connection is back. Do not close this tab until then.', tone: 'warn' };
    case 'failed':
      return { text: 'Not saved', detail: status.message, tone: 'bad' };
  }
}

const toneClass = {
  ok: 'border-ok bg-ok-soft text-ok',
  busy: 'border-primary bg-primary-soft text-primary-strong',
  warn: 'border-caution bg-caution-soft text-caution',
  bad: 'border-danger bg-danger-soft text-danger-strong',
  quiet: 'border-rule bg-surface text-muted',
};

/** Where the working copy stands with the server, in plain words, announced politely as it changes. */
export function SaveStatusText() {
  const { canEditLines } = usePlanEditor();
  const status = useEditor((s) => s.status);
  const baseRevisionId = useEditor((s) => s.baseRevisionId);
  if (!canEditLines) {
    return (
      <p role="status" className={`inline-flex min-h-12 items-center gap-2 rounded-lg border-2 px-3 font-semibold ${toneClass.quiet}`}>
        Read only{baseRevisionId !== null ? ` · revision ${baseRevisionId}` : ''}
      </p>
    );
  }
  const { text, detail, tone } = words(status);
  const Icon = tone === 'ok' ? CircleCheck : tone === 'busy' ? (status.state === 'saving' ? LoaderCircle : PencilLine) : tone === 'warn' ? CloudOff : CircleAlert;
  return (
    <div role="status" aria-live="polite" className={`flex min-h-12 max-w-md flex-col justify-center rounded-lg border-2 px-3 py-1 ${toneClass[tone]}`} title={detail}>
      <span className="inline-flex items-center gap-2 font-semibold">
        <Icon aria-hidden="true" className={`size-5 shrink-0 ${status.state === 'saving' ? 'animate-spin' : ''}`} />
        <span data-testid="save-status">{text}</span>
      </span>
      {detail && (status.state === 'failed' || status.state === 'offline') && <span className="text-sm text-ink">{detail}</span>}
    </div>
  );
}
