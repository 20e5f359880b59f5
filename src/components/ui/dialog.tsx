import { useEffect, useId, useRef, type ReactNode } from 'react';

/**
 * A modal box over the page for a choice that must be made before going on (a conflict on save, leaving
 * with changes). Focus moves into it and comes back to where it was; Escape is the same as its cancel.
 */
export function Dialog({ title, children, onCancel, footer }: { title: ReactNode; children: ReactNode; onCancel: () => void; footer?: ReactNode }) {
  const titleId = useId();
  const box = useRef<HTMLDivElement>(null);

  useEffect(() => {
    const before = document.activeElement as HTMLElement | null;
    const first = box.current?.querySelector<HTMLElement>('button, [href], input, select, textarea');
    (first ?? box.current)?.focus();
    return () => before?.focus?.();
  }, []);

  return (
    <div className="fixed inset-0 z-40 flex items-center justify-center bg-ink/60 p-4">
      <div
        ref={box}
        role="dialog"
        aria-modal="true"
        aria-labelledby={titleId}
        tabIndex={-1}
        className="flex max-h-[90vh] w-full max-w-xl flex-col gap-4 overflow-y-auto rounded-xl border-2 border-ink bg-surface p-6 shadow-xl"
        onKeyDown={(event) => {
          if (event.key === 'Escape') {
            event.stopPropagation();
            onCancel();
          }
          // Keep Tab inside the box while it is open.
          if (event.key === 'Tab' && box.current) {
            const items = [...box.current.querySelectorAll<HTMLElement>('button:not([disabled]), [href], input:not([disabled]), select, textarea')];
            const first = items[0];
            const last = items[items.length - 1];
            if (event.shiftKey && document.activeElement === first) {
              event.preventDefault();
              last?.focus();
            } else if (!event.shiftKey && document.activeElement === last) {
              event.preventDefault();
              first?.focus();
            }
          }
        }}
      >
        <h2 id={titleId} className="text-2xl font-bold">
          {title}
        </h2>
        <div className="flex flex-col gap-3 text-lg">{children}</div>
        {footer && <div className="flex flex-wrap gap-3">{footer}</div>}
      </div>
    </div>
  );
}
