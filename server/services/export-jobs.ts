import { randomUUID } from 'node:crypto';
import type { ExportJobStatus } from '../../shared/api/exports';
import { AppError, notFound } from '../errors';
import type { ExportFile } from './export-files';

/**
 * Exports that may take more than a second (the whole-hull zip, the tiled PDF of a big part) are made in
 * the background: POST starts one and answers at once, GET reports how many pages or files are made (from
 * the writers' own progress hooks, so the bar moves as the work does, not as bytes cross a fast local
 * network after the work is over), and GET .../file sends it once made. Jobs live in this process's memory
 * (Loftbench is one process), belong to the person who started them, and are forgotten a while after.
 */

interface Job {
  id: string;
  hullId: number;
  userId: number;
  status: ExportJobStatus;
  file: ExportFile | null;
}

/** How long a finished job's file is kept for its download (our choice: long enough to come back to a tab). */
const KEEP_MS = 10 * 60 * 1000;
/** Jobs one person may have running at once; more waits for one to end (each holds a whole file in memory). */
const MAX_RUNNING_PER_PERSON = 3;

const jobs = new Map<string, Job>();

function forgetLater(id: string): void {
  setTimeout(() => jobs.delete(id), KEEP_MS).unref();
}

/**
 * Starts making a file: `make` reports its steps through the callback it is given and returns the file.
 * `fileName` is known before it is made (the client shows it). An error the person can fix becomes the
 * job's `error` in the one error shape; anything else is logged by the caller's `onFault`.
 */
export function exportJobStart(
  owner: { hullId: number; userId: number },
  plan: { fileName: string; unit: ExportJobStatus['unit']; total: number },
  make: (progress: (done: number, total: number) => void) => Promise<ExportFile>,
  onFault: (err: unknown) => void,
): ExportJobStatus {
  const running = [...jobs.values()].filter((j) => j.userId === owner.userId && j.status.state === 'running').length;
  if (running >= MAX_RUNNING_PER_PERSON) throw new AppError(429, 'too_many_exports', `You already have ${running} exports being made; wait for one to finish.`);
  const id = randomUUID();
  const job: Job = { id, ...owner, file: null, status: { id, state: 'running', done: 0, total: plan.total, unit: plan.unit, fileName: plan.fileName, bytes: null, error: null } };
  jobs.set(id, job);
  const progress = (done: number, total: number) => {
    job.status = { ...job.status, done, total };
  };
  // Started on the next turn of the event loop, so the POST answers before any work is done.
  setImmediate(() => {
    make(progress)
      .then((file) => {
        job.file = file;
        job.status = { ...job.status, state: 'done', done: job.status.total, fileName: file.name, bytes: file.data.length };
      })
      .catch((err: unknown) => {
        const known = err instanceof AppError && err.expected;
        if (!known) onFault(err);
        job.status = { ...job.status, state: 'failed', error: known ? { code: err.code, message: err.message, ...(err.field ? { field: err.field } : {}) } : { code: 'internal', message: 'Something went wrong on the server while making this file.' } };
      })
      .finally(() => forgetLater(id));
  });
  return job.status;
}

function jobOf(hullId: number, userId: number, jobId: string): Job {
  const job = jobs.get(jobId);
  // Someone else's job, or one on another hull, is as unknown as one that never was.
  if (!job || job.hullId !== hullId || job.userId !== userId) throw notFound('No such export: it was made more than 10 minutes ago, or the server has restarted since it was started. Start it again.');
  return job;
}

/** Where the job is. */
export function exportJobStatus(hullId: number, userId: number, jobId: string): ExportJobStatus {
  return jobOf(hullId, userId, jobId).status;
}

/** The finished file; 409 while it is still being made, the job's own error if it failed. */
export function exportJobFile(hullId: number, userId: number, jobId: string): ExportFile {
  const job = jobOf(hullId, userId, jobId);
  if (job.status.state === 'failed') {
    const e = job.status.error!;
    throw new AppError(e.code === 'internal' ? 500 : 400, e.code, e.message, e.field);
  }
  if (!job.file) throw new AppError(409, 'export_not_ready', `${job.status.fileName} is still being made (${job.status.done} of ${job.status.total} ${job.status.unit}).`);
  return job.file;
}
