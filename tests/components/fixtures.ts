import type { SessionUser } from '../../shared/api/auth';
import type { CrewMember, HullSummary } from '../../shared/api/hulls';
import type { Reply } from './api-stub';

// Invented people and boats for the tests.
export const ann: SessionUser = { id: 1, email: 'ann.marsh@example.test', displayName: 'Ann Marsh' };
export const tomas: SessionUser = { id: 2, email: 'tomas.reed@example.test', displayName: 'Tomas Reed' };
export const priya: SessionUser = { id: 3, email: 'priya.hale@example.test', displayName: 'Priya Hale' };

export const signedOutSession: Reply = { body: { user: null, csrfToken: 'token-anon' } };
export function sessionOf(user: SessionUser, csrfToken = `token-${user.id}`): Reply {
  return { body: { user, csrfToken } };
}

export function hull(overrides: Partial<HullSummary> = {}): HullSummary {
  return {
    id: 3,
    name: 'Sand Piper, hull 2',
    units: 'mm',
    notes: '',
    role: 'owner',
    archived: false,
    createdAt: '2025-03-02T09:15:00.000Z',
    updatedAt: '2025-04-11T16:40:00.000Z',
    ...overrides,
  };
}

export function member(user: SessionUser, role: CrewMember['role']): CrewMember {
  return { userId: user.id, email: user.email, displayName: user.displayName, role };
}
