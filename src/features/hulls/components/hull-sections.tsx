import { Lock } from 'lucide-react';

/** The parts of a hull's workspace still to come; listed so the crew can see the shape of the work, never with invented content. */
const comingParts = ['Lines', 'Frames', 'Print shop', 'Downloads', 'Build log'] as const;

/** The hull's parts as a row of tabs (wrapping on narrow screens): Crew is the one built so far; the others say plainly they are not built yet. */
export function HullSections() {
  return (
    <nav aria-label="Parts of this hull">
      <ul className="flex flex-wrap gap-2">
        <li>
          <span aria-current="page" className="inline-flex min-h-12 items-center rounded-lg border-2 border-primary bg-primary px-4 font-semibold text-white">
            Crew
          </span>
        </li>
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
  );
}
