import { Link } from 'react-router-dom';
import { TriangleAlert } from 'lucide-react';

/** The safety line on every page: the work this app feeds can hurt people. */
export function AppFooter() {
  return (
    <footer className="mt-auto border-t-4 border-mark bg-surface">
      <div className="mx-auto flex max-w-6xl items-start gap-3 px-4 py-4 sm:px-6">
        <TriangleAlert aria-hidden="true" className="mt-1 size-6 shrink-0 text-caution" />
        <p className="text-ink">
          Epoxy sensitises skin and saws take fingers: wear gloves and eye protection, keep guards on, use push sticks. Frame sizes
          come from your designer and the rules; Loftbench draws what it is told and does not certify structure.{' '}
          <Link to="/safety" className="inline-flex min-h-11 items-center font-semibold text-primary underline underline-offset-4">
            Safety notes
          </Link>
        </p>
      </div>
    </footer>
  );
}
