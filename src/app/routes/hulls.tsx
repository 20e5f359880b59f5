import { Plus } from 'lucide-react';
import { ButtonLink } from '../../components/ui/button-link';
import { PageHeader } from '../../components/ui/page-header';
import { HullList } from '../../features/hulls/components/hull-list';

export function HullsRoute() {
  return (
    <>
      <title>Hulls · Loftbench</title>
      <PageHeader
        title="Hulls"
        lead="The boats you build, design or help on."
        actions={
          <ButtonLink to="/hulls/new">
            <Plus aria-hidden="true" className="size-5" />
            New hull
          </ButtonLink>
        }
      />
      <HullList />
    </>
  );
}
