import { roles } from '../../../../shared/api/hulls';
import { roleAbilities, roleLabels } from '../../../lib/labels';

/** One line per role saying what it may do on a hull. */
export function RoleGuide() {
  return (
    <section aria-labelledby="role-guide-heading" className="flex flex-col gap-3">
      <h3 id="role-guide-heading" className="text-lg font-semibold">
        What each role may do
      </h3>
      <dl className="grid grid-cols-1 gap-x-4 gap-y-2 sm:grid-cols-[8rem_1fr]">
        {roles.map((role) => (
          <div key={role} className="contents">
            <dt className="font-semibold">{roleLabels[role]}</dt>
            <dd className="mb-2 text-muted sm:mb-0">{roleAbilities[role]}</dd>
          </div>
        ))}
      </dl>
    </section>
  );
}
