import { useEffect, useRef, type ReactNode } from 'react';
import { Button } from './button';

/**
 * A question asked in the page, right where the button was pressed (never window.confirm): the words, a
 * button that does it and one that does not. Focus goes to the safe choice first.
 */
export function ConfirmInline({
  question,
  confirmLabel,
  cancelLabel = 'Keep',
  onConfirm,
  onCancel,
  busy = false,
  tone = 'danger',
}: {
  question: ReactNode;
  confirmLabel: string;
  cancelLabel?: string;
  onConfirm: () => void;
  onCancel: () => void;
  busy?: boolean;
  tone?: 'danger' | 'primary';
}) {
  const keep = useRef<HTMLButtonElement>(null);
  useEffect(() => keep.current?.focus(), []);
  return (
    <div role="group" aria-label="Confirm" className="flex flex-col gap-3 rounded-lg border-2 border-danger bg-danger-soft p-3">
      <p className="font-semibold text-ink">{question}</p>
      <div className="flex flex-wrap gap-3">
        <Button ref={keep} variant="secondary" onClick={onCancel}>
          {cancelLabel}
        </Button>
        <Button variant={tone} busy={busy} onClick={onConfirm}>
          {confirmLabel}
        </Button>
      </div>
    </div>
  );
}
