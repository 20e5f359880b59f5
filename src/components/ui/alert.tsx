import type { ReactNode } from 'react';
import { CircleAlert, CircleCheck, Info, TriangleAlert } from 'lucide-react';

export type AlertTone = 'error' | 'caution' | 'info' | 'ok';

const tones: Record<AlertTone, { box: string; Icon: typeof Info }> = {
  error: { box: 'border-danger bg-danger-soft text-danger-strong', Icon: CircleAlert },
  caution: { box: 'border-caution bg-caution-soft text-caution', Icon: TriangleAlert },
  info: { box: 'border-primary bg-primary-soft text-primary-strong', Icon: Info },
  ok: { box: 'border-ok bg-ok-soft text-ok', Icon: CircleCheck },
};

/** A boxed message. Errors are announced at once (role="alert"); the rest politely (role="status"). */
export function Alert({ tone = 'info', title, children, className = '' }: { tone?: AlertTone; title?: ReactNode; children?: ReactNode; className?: string }) {
  const { box, Icon } = tones[tone];
  return (
    <div role={tone === 'error' ? 'alert' : 'status'} className={`flex gap-3 rounded-lg border-l-4 px-4 py-3 ${box} ${className}`}>
      <Icon aria-hidden="true" className="mt-0.5 size-6 shrink-0" />
      <div className="flex flex-col gap-1">
        {title && <p className="font-semibold">{title}</p>}
        {children && <div className="text-ink">{children}</div>}
      </div>
    </div>
  );
}
