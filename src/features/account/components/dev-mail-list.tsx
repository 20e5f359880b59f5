import { Alert } from '../../../components/ui/alert';
import { Loading } from '../../../components/ui/loading';
import { ApiError, describeError } from '../../../lib/api-client';
import { formatWhen } from '../../../lib/labels';
import { useDevMail } from '../api/get-dev-mail';

/** Development only: the mail the local fake SMTP server received, newest first, with the links in it clickable. */
export function DevMailList() {
  const mail = useDevMail();
  if (mail.isPending) return <Loading label="Reading the local outbox…" />;
  if (mail.isError) {
    if (mail.error instanceof ApiError && mail.error.status === 404) {
      return <Alert tone="info" title="No local outbox here.">This page exists only when Loftbench runs for development or the demo, on this machine, with its local fake mail server.</Alert>;
    }
    return <Alert tone="error">{describeError(mail.error)}</Alert>;
  }
  if (mail.data.messages.length === 0) return <p className="text-lg">No mail has been sent yet.</p>;
  return (
    <ol className="flex flex-col gap-4">
      {mail.data.messages.map((m) => (
        <li key={m.id} className="flex flex-col gap-2 rounded-xl border border-rule bg-surface p-5">
          <p className="text-lg font-semibold">{m.subject}</p>
          <p className="text-sm text-muted">
            To {m.envelopeTo.join(', ')} · {formatWhen(m.receivedAt)}
          </p>
          <pre className="font-mono text-sm whitespace-pre-wrap">
            {m.text.split(/(https?:\/\/\S+)/).map((part, i) =>
              /^https?:\/\//.test(part) ? (
                <a key={i} href={part} className="font-semibold text-primary underline underline-offset-4 break-all">
                  {part}
                </a>
              ) : (
                part
              ),
            )}
          </pre>
        </li>
      ))}
    </ol>
  );
}
