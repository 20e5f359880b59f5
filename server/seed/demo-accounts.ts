import type { Role } from '../../shared/api/hulls';

/**
 * The demo accounts `npm start` seeds into an empty database, one per kind of user. Invented people;
 * the README lists the same credentials, and the browser tests sign in with them.
 */
export const demoAccounts = [
  { email: 'builder@demo.loftbench.test', password: 'demo-builder-2026', displayName: 'Rowan Teale', role: 'owner' },
  { email: 'helper@demo.loftbench.test', password: 'demo-helper-2026', displayName: 'Sam Quillon', role: 'helper' },
  { email: 'designer@demo.loftbench.test', password: 'demo-designer-2026', displayName: 'Dana Firth', role: 'designer' },
] as const satisfies readonly { email: string; password: string; displayName: string; role: Role }[];

export const demoHull = {
  name: 'Saltmarsh skiff 4.9 m (demo)',
  units: 'mm' as const,
  notes: 'An invented plywood skiff for trying Loftbench out: 4.9 m, hard chine, 9 mm bottom, 6 mm sides.',
};
