import { z } from 'zod';

/** Roles a person can hold on a hull; see DESIGN.md section 7 for what each may do. */
export const roles = ['owner', 'builder', 'designer', 'helper'] as const;
export const roleSchema = z.enum(roles);
export type Role = z.infer<typeof roleSchema>;

/** Units a hull's offsets are typed and read in: millimetres, or feet-inches-eighths. */
export const hullUnitsSchema = z.enum(['mm', 'ftin']);
export type HullUnits = z.infer<typeof hullUnitsSchema>;

/** Body of POST /api/hulls. */
export const createHullSchema = z.object({
  name: z.string().trim().min(1, { message: 'Give the hull a name' }).max(120),
  units: hullUnitsSchema.default('mm'),
  notes: z.string().max(2000).default(''),
});
export type CreateHullInput = z.input<typeof createHullSchema>;

/** Body of POST /api/hulls/:hullId/crew: the owner adds an existing account by e-mail. */
export const addMemberSchema = z.object({
  email: z.email({ message: 'Enter a valid e-mail address' }).max(254),
  role: roleSchema,
});
export type AddMemberInput = z.infer<typeof addMemberSchema>;

/** Body of PATCH /api/hulls/:hullId/crew/:userId. */
export const changeRoleSchema = z.object({ role: roleSchema });
export type ChangeRoleInput = z.infer<typeof changeRoleSchema>;

/** A hull as listed for the signed-in person, with their own role on it. */
export interface HullSummary {
  id: number;
  name: string;
  units: HullUnits;
  notes: string;
  role: Role;
  archived: boolean;
  createdAt: string;
  updatedAt: string;
}

/** One member of a hull's crew. */
export interface CrewMember {
  userId: number;
  email: string;
  displayName: string;
  role: Role;
}

/** The one error shape every API error has. `field` is the dotted path of the offending input, if any. */
export interface ApiErrorBody {
  error: { code: string; message: string; field?: string; issues?: { field: string; message: string }[] };
}
