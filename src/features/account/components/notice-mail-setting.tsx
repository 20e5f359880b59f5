import { Alert } from '../../../components/ui/alert';
import { Loading } from '../../../components/ui/loading';
import { describeError } from '../../../lib/api-client';
import { useAccountSettings } from '../api/get-account-settings';
import { usePutAccountSettings } from '../api/put-account-settings';

/** Whether a notice (a newer revision of something one of my hulls took) also comes by e-mail. */
export function NoticeMailSetting() {
  const settings = useAccountSettings();
  const put = usePutAccountSettings();
  if (settings.isPending) return <Loading label="Loading your settings…" />;
  if (settings.isError) return <Alert tone="error">{describeError(settings.error)}</Alert>;
  const checked = put.isPending ? put.variables.noticeMail : settings.data.settings.noticeMail;
  return (
    <section aria-labelledby="notice-mail-heading" className="flex flex-col gap-3">
      <h2 id="notice-mail-heading" className="text-xl font-bold">
        Notices by e-mail
      </h2>
      <p className="text-muted">Notices always show in Loftbench (the bell at the top). You can have each one sent to your e-mail as well.</p>
      <label className="flex min-h-12 items-center gap-3">
        <input type="checkbox" className="size-5" checked={checked} disabled={put.isPending} onChange={(e) => put.mutate({ noticeMail: e.target.checked })} />
        E-mail me when a hull of mine has a newer revision to look at
      </label>
      {put.isError && <Alert tone="error">{describeError(put.error)}</Alert>}
      {put.isSuccess && !put.isPending && <p role="status" className="text-ok">Saved.</p>}
    </section>
  );
}
