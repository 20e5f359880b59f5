import { PageHeader } from '../../components/ui/page-header';
import { NoticesList } from '../../features/notices/components/notices-list';

/** `/notices`: newer revisions of what the person's hulls took from the Library. */
export function NoticesRoute() {
  return (
    <>
      <title>Notices · Loftbench</title>
      <PageHeader title="Notices" lead="A designer published a newer revision of something one of your hulls took from the Library. Compare, then move the hull or stay." />
      <NoticesList />
    </>
  );
}
