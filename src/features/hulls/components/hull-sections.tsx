import { NavLink } from 'react-router-dom';
import { Lock } from 'lucide-react';

/** The parts of a hull's workspace still to come; listed so the crew can see the shape of the work, never with invented content. */
const comingParts = ['Print shop', 'Downloads'] as const;

const builtParts = [
  { to: '', label: 'Crew', end: true },
  { to: 'lines', label: 'Lines', end: false },
  { to: 'frames', label: 'Frames', end: false },
  { to: 'history', label: 'Revisions', end: false },
  { to: 'build-log', label: 'Build log', end: false },
] as const;

const togetherParts = [
  { to: 'library', label: 'From the Library' },
  { to: 'invitations', label: 'Invitations' },
] as const;

const tab = ({ isActive }: { isActive: boolean }) =>
  'inline-flex min-h-12 items-center rounded-lg border-2 px-4 font-semibold ' +
  (isActive ? 'border-primary bg-primary text-white' : 'border-edge bg-surface text-ink hover:bg-primary-soft');

/** The hull's parts as a row of tabs (wrapping on narrow screens); the parts not built yet say so plainly. */
export function HullSections({ hullId }: { hullId: number }) {
  return (
    <div className="flex flex-col gap-2">
      <nav aria-label="Parts of this hull">
        <ul className="flex flex-wrap gap-2">
          {builtParts.map((part) => (
            <li key={part.label}>
              <NavLink to={`/hulls/${hullId}${part.to ? `/${part.to}` : ''}`} end={part.end} className={tab}>
                {part.label}
              </NavLink>
            </li>
          ))}
          {comingParts.map((part) => (
            <li key={part}>
              <span aria-disabled="true" className="inline-flex min-h-12 cursor-not-allowed items-center gap-2 rounded-lg border-2 border-dashed border-rule px-4 text-muted">
                <Lock aria-hidden="true" className="size-4" />
                {part}
                <span className="text-sm">(not built yet)</span>
              </span>
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
