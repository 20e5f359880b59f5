import type { ComponentProps } from 'react';

/** A white panel on the paper background. */
export function Card({ className = '', ...props }: ComponentProps<'div'>) {
  return <div className={`rounded-xl border border-rule bg-surface p-5 shadow-sm sm:p-6 ${className}`} {...props} />;
}
