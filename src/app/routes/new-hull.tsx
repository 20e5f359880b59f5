import { Card } from '../../components/ui/card';
import { PageHeader } from '../../components/ui/page-header';
import { CreateHullForm } from '../../features/hulls/components/create-hull-form';

export function NewHullRoute() {
  return (
    <div className="max-w-2xl">
      <title>New hull · Loftbench</title>
      <PageHeader title="New hull" lead="Name the boat and choose the units its table of offsets is written in. You become its owner." />
      <Card>
        <CreateHullForm />
      </Card>
    </div>
  );
}
