import { NavLink } from 'react-router-dom';

const hullParts = [
  { to: '', label: 'Crew', end: true },
  { to: 'lines', label: 'Lines', end: false },
  { to: 'frames', label: 'Frames', end: false },
  { to: 'drawing', label: 'Drawing', end: false },
  { to: 'history', label: 'Revisions', end: false },
  { to: 'build-log', label: 'Build log', end: false },
  { to: 'print-shop', label: 'Print shop', end: false },
  { to: 'downloads', label: 'Downloads', end: false },
] as const;

const togetherParts = [
  { to: 'library', label: 'From the Library' },
  { to: 'invitations', label: 'Invitations' },
] as const;

const tab = ({ isActive }: { isActive: boolean }) =>
  'inline-flex min-h-12 items-center rounded-lg border-2 px-4 font-semibold ' +
  (isActive ? 'border-primary bg-primary text-white' : 'border-edge bg-surface text-ink hover:bg-primary-soft');

/** The hull's parts as a row of tabs (wrapping on narrow screens). */
export function HullSections({ hullId }: { hullId: number }) {
  return (
    <div className="flex flex-col gap-2">
      <nav aria-label="Parts of this hull">
        <ul className="flex flex-wrap gap-2">
          {hullParts.map((part) => (
            <li key={part.label}>
              <NavLink to={`/hulls/${hullId}${part.to ? `/${part.to}` : ''}`} end={part.end} className={tab}>
                {part.label}
              </NavLink>
            </li>
          ))}
        </ul>
      </nav>
      {/* The Library and invitations: working with people off this hull's crew, in a row of their own. */}
      <nav aria-label="Working together on this hull">
        <ul className="flex flex-wrap gap-2">
          {togetherParts.map((part) => (
            <li key={part.label}>
              <NavLink to={`/hulls/${hullId}/${part.to}`} className={tab}>
                {part.label}
              </NavLink>
            </li>
          ))}
        </ul>
      </nav>
    </div>
  );
}
