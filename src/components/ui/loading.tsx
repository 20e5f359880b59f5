import { LoaderCircle } from 'lucide-react';

/** A spinner with words, for a part of the page waiting on the server. */
export function Loading({ label = 'Loading…' }: { label?: string }) {
  return (
    <p role="status" className="flex items-center gap-3 py-6 text-lg text-muted">
      <LoaderCircle aria-hidden="true" className="size-6 animate-spin" />
      {label}
    </p>
  );
}
