import { PageHeader } from '../../components/ui/page-header';
import { DevMailList } from '../../features/account/components/dev-mail-list';

/** `/dev/mail`: development and demo only, the mail the local fake SMTP server received. */
export function DevMailRoute() {
  return (
    <>
      <title>Local outbox · Loftbench</title>
      <PageHeader title="Local outbox" lead="Outside production, Loftbench sends every mail to a fake mail server on this machine. Here is what it received, newest first; the links in it work." />
      <DevMailList />
    </>
  );
}
