import type { ReactNode } from 'react';

/** What a screen shows where there is nothing yet (no parts, no lines, no revision): a dashed box with the words. */
export function EmptyNote({ children }: { children: ReactNode }) {
  return <p className="rounded-lg border-2 border-dashed border-rule bg-surface p-5 text-lg text-muted">{children}</p>;
}
