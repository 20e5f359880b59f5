import { z } from 'zod';

/** Body of POST /api/auth/sign-up. The same schema validates the form in the browser and the request on the server. */
export const signUpSchema = z.object({
  email: z.email({ message: 'Enter a valid e-mail address' }).max(254),
  displayName: z.string().trim().min(1, { message: 'Enter your name' }).max(80),
  password: z.string().min(10, { message: 'Use at least 10 characters' }).max(200),
});
export type SignUpInput = z.infer<typeof signUpSchema>;

/** Body of POST /api/auth/sign-in. */
export const signInSchema = z.object({
  email: z.email({ message: 'Enter a valid e-mail address' }).max(254),
  password: z.string().min(1, { message: 'Enter your password' }).max(200),
});
export type SignInInput = z.infer<typeof signInSchema>;

/** A signed-in person as the API returns them. */
export interface SessionUser {
  id: number;
  email: string;
  displayName: string;
}

/** GET /api/session: who is signed in (null when nobody) and the token to send as `X-CSRF-Token`. */
export interface SessionResponse {
  user: SessionUser | null;
  csrfToken: string;
}
