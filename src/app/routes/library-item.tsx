import { Link, useParams } from 'react-router-dom';
import { Alert } from '../../components/ui/alert';
import { Card } from '../../components/ui/card';
import { Loading } from '../../components/ui/loading';
import { ApiError, describeError } from '../../lib/api-client';
import { useLibraryItem } from '../../features/library/api/get-library-item';
import { ItemView } from '../../features/library/components/item-view';

const backLink = 'inline-flex min-h-12 items-center font-semibold text-primary underline underline-offset-4';

function NotInLibrary() {
  return (
    <Card className="mx-auto flex max-w-2xl flex-col items-start gap-4">
      <title>Not in the Library · Loftbench</title>
      <h1 className="text-2xl font-bold">Nothing here</h1>
      <p className="text-lg">There is no such item in the Library, or its author does not share it with you.</p>
      <Link to="/library" className={backLink}>
        Back to the Library
      </Link>
    </Card>
  );
}

function Item({ itemId }: { itemId: number }) {
  const item = useLibraryItem(itemId);
  if (item.isPending) return <Loading label="Loading…" />;
  if (item.isError) {
    if (item.error instanceof ApiError && item.error.status === 404) return <NotInLibrary />;
    return <Alert tone="error" title="This could not be loaded.">{describeError(item.error)}</Alert>;
  }
  return (
    <>
      <title>{`${item.data.item.latest.name} · Library · Loftbench`}</title>
      <ItemView item={item.data.item} />
    </>
  );
}

/** `/library/:itemId`: one published camber curve or set of lines. */
export function LibraryItemRoute() {
  const { itemId } = useParams();
  const id = Number(itemId);
  if (!/^\d+$/.test(itemId ?? '') || id <= 0) return <NotInLibrary />;
  return <Item key={id} itemId={id} />;
}
