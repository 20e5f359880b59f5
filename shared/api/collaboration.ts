import { z } from 'zod';
import { roleSchema, type Role } from './hulls';

/**
 * Working together: invitations by e-mail, password reset, the person's own account settings, and the
 * mail the local fake SMTP server received (development only). One schema per body, used by the
 * client's forms and the server's validation.
 */

const email = z.email({ message: 'Enter a valid e-mail address' }).max(254);
const password = z.string().min(10, { message: 'Use at least 10 characters' }).max(200);
/** A token from a link in a mail: 43 characters of base64url (32 random bytes). */
export const mailTokenSchema = z
  .string()
  .trim()
  .regex(/^[A-Za-z0-9_-]{43}$/, { message: 'This link is incomplete: open it again from the e-mail, or copy the whole address' });

// ---------------------------------------------------------------------------------------------------
// Invitations

/** Body of POST /api/hulls/:hullId/invitations: the owner invites someone by e-mail, with a role. */
export const createInvitationSchema = z.object({ email, role: roleSchema });
export type CreateInvitationInput = z.infer<typeof createInvitationSchema>;

/** A pending invitation as the hull's owner sees it. */
export interface InvitationSummary {
  id: number;
  email: string;
  role: Role;
  invitedByName: string;
  createdAt: string;
  expiresAt: string;
}

/** Body of POST /api/invitations/preview: what the link in the mail is an invitation to. */
export const invitationTokenSchema = z.object({ token: mailTokenSchema });

/** POST /api/invitations/preview. */
export interface InvitationPreview {
  hullName: string;
  role: Role;
  email: string;
  invitedByName: string;
  expiresAt: string;
}

/**
 * Body of POST /api/invitations/accept. Signed in: the membership goes to the signed-in account.
 * Signed out: `newAccount` creates an account on the invited e-mail (the link proves it is theirs).
 */
export const acceptInvitationSchema = z.object({
  token: mailTokenSchema,
  newAccount: z
    .object({
      displayName: z.string().trim().min(1, { message: 'Enter your name' }).max(80),
      password,
    })
    .optional(),
});
export type AcceptInvitationInput = z.infer<typeof acceptInvitationSchema>;

/** POST /api/invitations/accept: the hull the person is now on, and their role there. */
export interface AcceptInvitationResponse {
  hullId: number;
  role: Role;
  /** They were on the crew already: the invitation is used up and their role is unchanged. */
  alreadyMember: boolean;
}

// ---------------------------------------------------------------------------------------------------
// Password reset and change

/** Body of POST /api/account/password-reset: send a reset link to this e-mail if it has an account. */
export const requestPasswordResetSchema = z.object({ email });
export type RequestPasswordResetInput = z.infer<typeof requestPasswordResetSchema>;

/** Body of POST /api/account/password-reset/preview. */
export const passwordResetTokenSchema = z.object({ token: mailTokenSchema });

/** Body of POST /api/account/password-reset/complete. */
export const completePasswordResetSchema = z.object({ token: mailTokenSchema, password });
export type CompletePasswordResetInput = z.infer<typeof completePasswordResetSchema>;

/** Body of POST /api/account/password: change the password while signed in. */
export const changePasswordSchema = z.object({
  currentPassword: z.string().min(1, { message: 'Enter your present password' }).max(200),
  newPassword: password,
  /** End every other session of the account (other browsers, a lost tablet). */
  signOutOthers: z.boolean().default(true),
});
export type ChangePasswordInput = z.input<typeof changePasswordSchema>;

// ---------------------------------------------------------------------------------------------------
// Account settings

/** Body of PUT /api/account/settings, and its answer. */
export const accountSettingsSchema = z.object({
  /** Also send an e-mail when a notice is raised (a newer revision of something a hull of mine took from the Library). */
  noticeMail: z.boolean(),
});
export type AccountSettings = z.infer<typeof accountSettingsSchema>;

// ---------------------------------------------------------------------------------------------------
// Development mail

/** One message the local fake SMTP server received (GET /api/dev/mail, development only). */
export interface FakeMailMessage {
  id: number;
  receivedAt: string;
  /** SMTP envelope: who the server really sent it from and to. */
  envelopeFrom: string;
  envelopeTo: string[];
  /** Header fields as written in the message. */
  from: string;
  to: string;
  subject: string;
  text: string;
}
