import { Plus } from 'lucide-react';
import { ButtonLink } from '../../components/ui/button-link';
import { PageHeader } from '../../components/ui/page-header';
import { LibraryList } from '../../features/library/components/library-list';

/** `/library`: the designers' published camber curves and lines. */
export function LibraryRoute() {
  return (
    <>
      <title>Library · Loftbench</title>
      <PageHeader
        title="Library"
        lead="Camber curves and lines that designers publish. Take one into a hull, and you hear of each newer revision."
        actions={
          <ButtonLink to="/library/new">
            <Plus aria-hidden="true" className="size-5" />
            Publish
          </ButtonLink>
        }
      />
      <LibraryList />
    </>
  );
}
