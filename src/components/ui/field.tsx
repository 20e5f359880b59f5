import { useId, type ComponentProps, type ReactNode } from 'react';
import { CircleAlert } from 'lucide-react';

interface FieldParts {
  label: ReactNode;
  /** A line of help under the label. */
  hint?: ReactNode;
  /** Shown under the control and tied to it with aria-describedby. */
  error?: string;
  /** Hide the label visually (it is still the control's accessible name), e.g. inside a table row. */
  hideLabel?: boolean;
}

const control =
  'block w-full min-h-12 rounded-lg border-2 bg-surface px-3 text-base text-ink ' +
  'aria-invalid:border-danger disabled:bg-paper disabled:text-muted';

function useFieldIds(id: string | undefined, hint: ReactNode, error: string | undefined) {
  const autoId = useId();
  const controlId = id ?? autoId;
  const hintId = hint ? `${controlId}-hint` : undefined;
  const errorId = error ? `${controlId}-error` : undefined;
  const describedBy = [hintId, errorId].filter(Boolean).join(' ') || undefined;
  return { controlId, hintId, errorId, describedBy };
}

function FieldShell({ parts, ids, children }: { parts: FieldParts; ids: ReturnType<typeof useFieldIds>; children: ReactNode }) {
  return (
    <div className="flex flex-col gap-1.5">
      <label htmlFor={ids.controlId} className={parts.hideLabel ? 'sr-only' : 'font-semibold'}>
        {parts.label}
      </label>
      {parts.hint && (
        <p id={ids.hintId} className="text-sm text-muted">
          {parts.hint}
        </p>
      )}
      {children}
      {parts.error && (
        <p id={ids.errorId} className="flex items-start gap-1.5 font-medium text-danger">
          <CircleAlert aria-hidden="true" className="mt-0.5 size-5 shrink-0" />
          <span>{parts.error}</span>
        </p>
      )}
    </div>
  );
}

export function InputField({ label, hint, error, hideLabel, id, className = '', ...props }: FieldParts & ComponentProps<'input'>) {
  const ids = useFieldIds(id, hint, error);
  return (
    <FieldShell parts={{ label, hint, error, hideLabel }} ids={ids}>
      <input
        id={ids.controlId}
        aria-invalid={error ? true : undefined}
        aria-describedby={ids.describedBy}
        className={`${control} ${error ? 'border-danger' : 'border-edge'} ${className}`}
        {...props}
      />
    </FieldShell>
  );
}

export function SelectField({ label, hint, error, hideLabel, id, className = '', children, ...props }: FieldParts & ComponentProps<'select'>) {
  const ids = useFieldIds(id, hint, error);
  return (
    <FieldShell parts={{ label, hint, error, hideLabel }} ids={ids}>
      <select
        id={ids.controlId}
        aria-invalid={error ? true : undefined}
        aria-describedby={ids.describedBy}
        className={`${control} ${error ? 'border-danger' : 'border-edge'} ${className}`}
        {...props}
      >
        {children}
      </select>
    </FieldShell>
  );
}

export function TextareaField({ label, hint, error, hideLabel, id, className = '', ...props }: FieldParts & ComponentProps<'textarea'>) {
  const ids = useFieldIds(id, hint, error);
  return (
    <FieldShell parts={{ label, hint, error, hideLabel }} ids={ids}>
      <textarea
        id={ids.controlId}
        aria-invalid={error ? true : undefined}
        aria-describedby={ids.describedBy}
        className={`${control} py-2 ${error ? 'border-danger' : 'border-edge'} ${className}`}
        {...props}
      />
    </FieldShell>
  );
}
