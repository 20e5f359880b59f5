import type { ComponentProps } from 'react';
import { LoaderCircle } from 'lucide-react';

export type ButtonVariant = 'primary' | 'secondary' | 'danger' | 'quiet' | 'on-dark';

const base =
  'inline-flex min-h-12 items-center justify-center gap-2 rounded-lg px-5 text-base font-semibold ' +
  'transition-colors disabled:cursor-not-allowed disabled:opacity-60 select-none';

const variants: Record<ButtonVariant, string> = {
  primary: 'bg-primary text-white hover:bg-primary-strong border-2 border-primary hover:border-primary-strong',
  secondary: 'bg-surface text-ink border-2 border-edge hover:bg-primary-soft',
  danger: 'bg-danger text-white border-2 border-danger hover:bg-danger-strong hover:border-danger-strong',
  quiet: 'bg-transparent text-primary border-2 border-transparent underline underline-offset-4 hover:bg-primary-soft',
  'on-dark': 'bg-transparent text-white border-2 border-white/80 hover:bg-white/15',
};

/** The classes of a button, for links that must look like one. */
export function buttonClasses(variant: ButtonVariant = 'primary', extra = ''): string {
  return `${base} ${variants[variant]} ${extra}`.trim();
}

export type ButtonProps = ComponentProps<'button'> & {
  variant?: ButtonVariant;
  /** Shows a spinner and blocks a second press while a request is under way; the name stays the same. */
  busy?: boolean;
};

export function Button({ variant = 'primary', busy = false, className = '', type = 'button', disabled, children, ...props }: ButtonProps) {
  return (
    <button type={type} className={buttonClasses(variant, className)} disabled={disabled || busy} aria-busy={busy || undefined} {...props}>
      {busy && <LoaderCircle aria-hidden="true" className="size-5 animate-spin" />}
      {children}
    </button>
  );
}
