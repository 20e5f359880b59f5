import { Link } from 'react-router-dom';
import type { LibraryItemSummary } from '../../../../shared/api/library';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Loading } from '../../../components/ui/loading';
import { describeError } from '../../../lib/api-client';
import { formatWhen } from '../../../lib/labels';
import { useLibrary } from '../api/get-library';
import { kindLabels, visibilityLabels } from './library-words';

function ItemRow({ item }: { item: LibraryItemSummary }) {
  return (
    <li className="flex flex-col gap-1 border-t border-rule py-3 first:border-t-0">
      <Link to={`/library/${item.id}`} className="inline-flex min-h-11 items-center text-lg font-semibold text-primary underline underline-offset-4">
        {item.latest.name}
      </Link>
      <p className="text-muted">
        {kindLabels[item.kind]} · revision {item.latest.number} · by {item.mine ? 'you' : item.authorName} · {visibilityLabels[item.visibility]} · {formatWhen(item.updatedAt)}
      </p>
    </li>
  );
}

function Group({ title, items, empty }: { title: string; items: LibraryItemSummary[]; empty: string }) {
  const id = `library-${title.toLowerCase().replace(/\W+/g, '-')}`;
  return (
    <section aria-labelledby={id} className="rounded-xl border border-rule bg-surface p-5">
      <h2 id={id} className="text-xl font-bold">
        {title}
      </h2>
      {items.length ? <ul className="mt-2">{items.map((i) => <ItemRow key={i.id} item={i} />)}</ul> : <p className="mt-2 text-muted">{empty}</p>}
    </section>
  );
}

/** The Library as the signed-in person sees it: what they published, what is shared with them, what is public. */
export function LibraryList() {
  const library = useLibrary();
  if (library.isPending) return <Loading label="Loading the Library…" />;
  if (library.isError) {
    return (
      <Alert tone="error" title="The Library could not be loaded.">
        <p>{describeError(library.error)}</p>
        <Button variant="secondary" className="mt-3" onClick={() => void library.refetch()}>
          Try again
        </Button>
      </Alert>
    );
  }
  const items = library.data.items;
  return (
    <div className="flex flex-col gap-5">
      <Group title="Published by you" items={items.filter((i) => i.mine)} empty="Nothing yet. Publish a camber curve or the lines of a hull for builders to take." />
      <Group title="Shared with you" items={items.filter((i) => !i.mine && i.visibility === 'shared')} empty="Nobody has shared anything with your e-mail address yet." />
      <Group title="Public" items={items.filter((i) => !i.mine && i.visibility === 'public')} empty="Nothing public yet." />
    </div>
  );
}
