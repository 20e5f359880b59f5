import { z } from 'zod';

/**
 * The server's whole configuration, parsed once from the environment. A bad or missing value stops the
 * server at start with the variable's name, rather than failing later on a request.
 */
const modeSchema = z.enum(['demo', 'development', 'test', 'production']);

const envSchema = z
  .object({
    LOFTBENCH_MODE: modeSchema.default('demo'),
    LOFTBENCH_HOST: z.string().default('127.0.0.1'),
    LOFTBENCH_PORT: z.coerce.number().int().min(0).max(65535).default(4310),
    LOFTBENCH_DB_HOST: z.string().default('127.0.0.1'),
    LOFTBENCH_DB_PORT: z.coerce.number().int().min(1).max(65535).default(3417),
    LOFTBENCH_DB_NAME: z.string().min(1).default('loftbench'),
    LOFTBENCH_DB_USER: z.string().min(1).default('loftbench'),
    LOFTBENCH_DB_PASSWORD: z.string().min(1, 'LOFTBENCH_DB_PASSWORD is required'),
    LOFTBENCH_SESSION_SECRET: z.string().min(32, 'LOFTBENCH_SESSION_SECRET must be at least 32 characters'),
    /** Extra origins allowed to make state-changing requests, comma-separated (the page's own origin always is). */
    LOFTBENCH_ALLOWED_ORIGINS: z.string().default(''),
    /** Set when served behind an HTTPS proxy: trusts X-Forwarded-* and marks cookies Secure. */
    LOFTBENCH_TRUST_PROXY: z.enum(['0', '1']).default('0'),
    LOFTBENCH_CLIENT_DIR: z.string().optional(),
    LOFTBENCH_DATA_DIR: z.string().optional(),
    LOFTBENCH_LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'silent']).optional(),
    // Outgoing mail (server/mail). Outside production the scripts start a local fake SMTP server and set these.
    LOFTBENCH_SMTP_HOST: z.string().min(1).optional(),
    LOFTBENCH_SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(587),
    /** '1': TLS from the first byte (port 465); '0': plain, upgraded with STARTTLS when the server offers it. */
    LOFTBENCH_SMTP_SECURE: z.enum(['0', '1']).default('0'),
    LOFTBENCH_SMTP_USER: z.string().min(1).optional(),
    LOFTBENCH_SMTP_PASSWORD: z.string().min(1).optional(),
    LOFTBENCH_MAIL_FROM: z.string().min(3).default('Loftbench <no-reply@loftbench.invalid>'),
    /** The address people open Loftbench at, for the links in mail (required in production when mail is on). */
    LOFTBENCH_PUBLIC_URL: z.url().optional(),
    /** The local fake SMTP server's HTTP side, read by the development mail page (never in production). */
    LOFTBENCH_MAIL_FAKE_URL: z.url().optional(),
    LOFTBENCH_INVITATION_DAYS: z.coerce.number().positive().max(90).default(7),
    LOFTBENCH_RESET_MINUTES: z.coerce.number().positive().max(24 * 60).default(60),
  })
  .superRefine((env, ctx) => {
    if (env.LOFTBENCH_MODE === 'production' && env.LOFTBENCH_TRUST_PROXY === '0' && env.LOFTBENCH_HOST !== '127.0.0.1') {
      // Allowed, but worth saying: without HTTPS the session cookie crosses the network in clear.
      ctx.addIssue({ code: 'custom', path: ['LOFTBENCH_TRUST_PROXY'], message: 'production on a public address needs HTTPS: put a proxy in front and set LOFTBENCH_TRUST_PROXY=1', fatal: false });
    }
    if (env.LOFTBENCH_MODE === 'production' && env.LOFTBENCH_SMTP_HOST && !env.LOFTBENCH_PUBLIC_URL) {
      // Links in mail must never be built from a request's Host header, which a caller chooses.
      ctx.addIssue({ code: 'custom', path: ['LOFTBENCH_PUBLIC_URL'], message: 'production mail needs LOFTBENCH_PUBLIC_URL (e.g. https://loftbench.example.org) for the links it sends' });
    }
  });

export type Mode = z.infer<typeof modeSchema>;

export interface Config {
  mode: Mode;
  host: string;
  port: number;
  db: { host: string; port: number; name: string; user: string; password: string };
  sessionSecret: string;
  allowedOrigins: string[];
  trustProxy: boolean;
  clientDir: string | null;
  dataDir: string | null;
  logLevel: string;
  mail: MailConfig;
}

export interface MailConfig {
  /** null: no SMTP server configured, so nothing can be sent (production without LOFTBENCH_SMTP_HOST). */
  smtp: { host: string; port: number; secure: boolean; user: string | null; password: string | null } | null;
  from: string;
  publicUrl: string | null;
  fakeUrl: string | null;
  invitationTtlMs: number;
  resetTtlMs: number;
}

/** Parse the environment into a Config, or throw an Error naming every bad variable. */
export function configFromEnv(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = envSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Loftbench cannot start: bad configuration\n${lines.join('\n')}`);
  }
  const e = parsed.data;
  return {
    mode: e.LOFTBENCH_MODE,
    host: e.LOFTBENCH_HOST,
    port: e.LOFTBENCH_PORT,
    db: { host: e.LOFTBENCH_DB_HOST, port: e.LOFTBENCH_DB_PORT, name: e.LOFTBENCH_DB_NAME, user: e.LOFTBENCH_DB_USER, password: e.LOFTBENCH_DB_PASSWORD },
    sessionSecret: e.LOFTBENCH_SESSION_SECRET,
    allowedOrigins: e.LOFTBENCH_ALLOWED_ORIGINS.split(',').map((s) => s.trim()).filter(Boolean),
    trustProxy: e.LOFTBENCH_TRUST_PROXY === '1',
    clientDir: e.LOFTBENCH_CLIENT_DIR ?? null,
    dataDir: e.LOFTBENCH_DATA_DIR ?? null,
    logLevel: e.LOFTBENCH_LOG_LEVEL ?? (e.LOFTBENCH_MODE === 'test' ? 'silent' : 'info'),
    mail: {
      smtp: e.LOFTBENCH_SMTP_HOST
        ? { host: e.LOFTBENCH_SMTP_HOST, port: e.LOFTBENCH_SMTP_PORT, secure: e.LOFTBENCH_SMTP_SECURE === '1', user: e.LOFTBENCH_SMTP_USER ?? null, password: e.LOFTBENCH_SMTP_PASSWORD ?? null }
        : null,
      from: e.LOFTBENCH_MAIL_FROM,
      publicUrl: e.LOFTBENCH_PUBLIC_URL?.replace(/\/+$/, '') ?? null,
      fakeUrl: e.LOFTBENCH_MODE === 'production' ? null : (e.LOFTBENCH_MAIL_FAKE_URL ?? null),
      invitationTtlMs: e.LOFTBENCH_INVITATION_DAYS * 24 * 3600 * 1000,
      resetTtlMs: e.LOFTBENCH_RESET_MINUTES * 60 * 1000,
    },
  };
}
