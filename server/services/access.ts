import type { Role } from '../../shared/api/hulls';

/**
 * What each role may do on a hull (DESIGN.md section 7). Everything that checks permission asks this
 * table, so a change of policy is one edit here.
 */
export const capabilities = ['read', 'edit-parts', 'edit-lines', 'export', 'build-log', 'manage-crew'] as const;
export type Capability = (typeof capabilities)[number];

const grants: Record<Role, readonly Capability[]> = {
  owner: ['read', 'edit-parts', 'edit-lines', 'export', 'build-log', 'manage-crew'],
  builder: ['read', 'edit-parts', 'edit-lines', 'export', 'build-log'],
  designer: ['read', 'edit-lines', 'export'],
  helper: ['read', 'export', 'build-log'],
};

export function roleMay(role: Role, capability: Capability): boolean {
  return grants[role].includes(capability);
}
