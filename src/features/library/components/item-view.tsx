import { Link } from 'react-router-dom';
import type { LibraryItemDetail } from '../../../../shared/api/library';
import type { Camber } from '../../../../shared/geometry/camber-schema';
import { ButtonLink } from '../../../components/ui/button-link';
import { Card } from '../../../components/ui/card';
import { formatWhen } from '../../../lib/labels';
import { DocumentPreview } from './document-preview';
import { conventionLabels, crownWords, kindLabels, shapeLabels, visibilityLabels } from './library-words';
import { SharingForm } from './sharing-form';
import { TakeIntoHullForm } from './take-into-hull-form';

function CamberFacts({ camber }: { camber: Camber }) {
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-6 gap-y-1">
      <dt className="text-muted">Shape</dt>
      <dd className="font-semibold">{shapeLabels[camber.shape]}</dd>
      <dt className="text-muted">Crown</dt>
      <dd className="font-mono font-semibold">{crownWords(camber.crown)}</dd>
      <dt className="text-muted">Convention</dt>
      <dd className="font-semibold">{conventionLabels[camber.convention]}</dd>
      {camber.shape === 'custom' && (
        <>
          <dt className="text-muted">Own points</dt>
          <dd className="font-mono">{camber.points.map((p) => `(${p.t}, ${p.h})`).join(' ')}</dd>
        </>
      )}
    </dl>
  );
}

/** One Library item: its newest revision drawn, its notes and rules, its revisions; the author may publish the next one, others take it into a hull. */
export function ItemView({ item }: { item: LibraryItemDetail }) {
  const latest = item.latest;
  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-col gap-1">
        <h1 className="text-3xl font-bold tracking-tight break-words">{latest.name}</h1>
        <p className="text-lg text-muted">
          {kindLabels[item.kind]} · revision {latest.number} of {item.revisionCount} · by {item.mine ? 'you' : item.authorName} · {visibilityLabels[item.visibility]}
        </p>
      </div>
      <Card className="flex flex-col gap-4">
        <DocumentPreview kind={item.kind} document={item.latestDocument} label={`Revision ${latest.number}`} />
        {item.kind === 'camber' && <CamberFacts camber={item.latestDocument as Camber} />}
        {latest.notes && (
          <section aria-labelledby="notes-heading">
            <h2 id="notes-heading" className="font-semibold">
              Notes
            </h2>
            <p className="max-w-prose whitespace-pre-line">{latest.notes}</p>
          </section>
        )}
        {latest.rules && (
          <section aria-labelledby="rules-heading">
            <h2 id="rules-heading" className="font-semibold">
              Rules that go with it
            </h2>
            <p className="max-w-prose whitespace-pre-line">{latest.rules}</p>
          </section>
        )}
      </Card>

      {item.mine ? (
        <div className="flex flex-col gap-6">
          <div>
            <ButtonLink to={`/library/${item.id}/revise`}>Publish a new revision</ButtonLink>
          </div>
          <Card>
            <SharingForm item={item} />
          </Card>
        </div>
      ) : (
        <Card>
          <TakeIntoHullForm item={item} />
        </Card>
      )}

      <section aria-labelledby="revisions-heading" className="flex flex-col gap-2">
        <h2 id="revisions-heading" className="text-xl font-bold">
          Revisions
        </h2>
        <p className="text-muted">A published revision never changes; each newer one is told to the hulls that took an older one.</p>
        <ol className="flex flex-col gap-2">
          {item.revisions.map((r) => (
            <li key={r.id} className="rounded-lg border border-rule bg-surface px-4 py-3">
              <p className="font-semibold">
                Revision {r.number}: {r.name} <span className="font-normal text-muted">· {formatWhen(r.createdAt)}</span>
              </p>
              {r.notes && <p className="whitespace-pre-line text-muted">{r.notes}</p>}
            </li>
          ))}
        </ol>
      </section>
      <Link to="/library" className="inline-flex min-h-12 items-center font-semibold text-primary underline underline-offset-4">
        Back to the Library
      </Link>
    </div>
  );
}
