import type { Router } from 'express';
import { signInSchema, signUpSchema, type SessionResponse } from '../../shared/api/auth';
import { AppError, parseInput } from '../errors';
import { signIn, signOut } from '../http/auth';
import { csrfTokenOf } from '../http/csrf';
import { signInLimits } from '../http/rate-limit';
import { userByCredentials, userCreate } from '../services/users';

export function registerAuthRoutes(router: Router) {
  router.get('/api/session', (req, res) => {
    const body: SessionResponse = { user: req.user ?? null, csrfToken: csrfTokenOf(req) };
    res.json(body);
  });

  router.post('/api/auth/sign-up', async (req, res) => {
    const input = parseInput(signUpSchema, req.body);
    const user = await userCreate(input);
    await signIn(req, user);
    res.status(201).json({ user });
  });

  router.post('/api/auth/sign-in', ...signInLimits(), async (req, res) => {
    const input = parseInput(signInSchema, req.body);
    const user = await userByCredentials(input.email, input.password);
    if (!user) throw new AppError(401, 'bad_credentials', 'Wrong e-mail address or password');
    await signIn(req, user);
    res.json({ user });
  });

  router.post('/api/auth/sign-out', async (req, res) => {
    if (req.user) await signOut(req);
    res.status(204).end();
  });
}
