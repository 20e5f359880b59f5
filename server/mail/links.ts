import type { Request } from 'express';
import type { Config } from '../config';

/**
 * The address links in mail start with. Configured (LOFTBENCH_PUBLIC_URL) wherever mail really leaves the
 * machine: production requires it, because a link built from the request's Host header would let anyone
 * have a reset mail point at their own site. Without it (development, the demo, the tests, where mail
 * only reaches the local fake) the links point where the request came from, so they open on the same
 * address the person uses, a workshop tablet's included.
 */
export function mailLinkBase(config: Config, req: Request): string {
  if (config.mail.publicUrl) return config.mail.publicUrl;
  if (config.mode === 'production') return `http://${config.host}:${config.port}`;
  return `${req.protocol}://${req.get('host')}`;
}
