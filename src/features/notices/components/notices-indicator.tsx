import { Bell } from 'lucide-react';
import { NavLink } from 'react-router-dom';
import { useNotices } from '../api/get-notices';

/** The header's mark for open notices: a bell with the count, to the notices page. */
export function NoticesIndicator({ onNavigate }: { onNavigate?: () => void }) {
  const notices = useNotices();
  const count = notices.data?.notices.length ?? 0;
  const label = count === 0 ? 'Notices' : `Notices: ${count} new`;
  return (
    <NavLink
      to="/notices"
      onClick={onNavigate}
      aria-label={label}
      className={({ isActive }) =>
        'inline-flex min-h-12 items-center gap-2 rounded-lg px-3 text-lg font-semibold hover:bg-white/15 ' + (isActive ? 'underline decoration-mark decoration-4 underline-offset-8' : '')
      }
    >
      <Bell aria-hidden="true" className="size-5" />
      <span className="sm:sr-only">Notices</span>
      {count > 0 && (
        <span aria-hidden="true" className="inline-flex min-w-7 items-center justify-center rounded-full bg-mark px-2 text-base font-bold text-ink">
          {count}
        </span>
      )}
    </NavLink>
  );
}
