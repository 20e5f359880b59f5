import { Link } from 'react-router-dom';
import { TriangleAlert } from 'lucide-react';

/** The safety line on every page: the work this app feeds can hurt people. */
export function AppFooter() {
  return (
    <footer className="mt-auto border-t-4 border-mark bg-surface">
      <div className="mx-auto flex max-w-6xl flex-col gap-2 px-4 py-4 sm:px-6 md:flex-row md:items-center md:gap-6">
        <p className="flex items-start gap-3 text-ink">
          <TriangleAlert aria-hidden="true" className="mt-0.5 size-6 shrink-0 text-caution" />
          <span>
            Epoxy sensitises skin and saws take fingers: wear gloves and eye protection, keep guards on, use push sticks. Frame
            sizes come from your designer and the rules; Loftbench draws what it is told and does not certify structure.
          </span>
        </p>
        <Link
          to="/safety"
          className="ml-9 inline-flex min-h-11 shrink-0 items-center self-start font-semibold text-primary underline underline-offset-4 md:ml-0 md:self-center"
        >
          Safety notes
        </Link>
      </div>
    </footer>
  );
}
