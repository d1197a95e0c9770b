/**
 * The job queue the job routes submit to: deps.jobs when the service was given one (PostgreSQL: the shared queue),
 * otherwise one in-process queue per app, started by the first route plugin that asks and stopped when the app
 * closes, so that every job route of an app shares it (two in-process queues would each resume the same jobs).
 */
import type { FastifyInstance } from 'fastify';
import { startJobs, type Jobs } from '../../../jobs/start-jobs.ts';
import type { AppDeps } from '../../types.ts';

const started = new WeakMap<AppDeps, Promise<Jobs>>();

export function jobsFor(app: FastifyInstance, deps: AppDeps): Promise<Jobs> {
  if (deps.jobs) return Promise.resolve(deps.jobs);
  let jobs = started.get(deps);
  if (!jobs) {
    jobs = startJobs({ db: deps.db, backend: deps.backend, work: true, inProcess: true, log: (level, fields, message) => app.log[level](fields, message) });
    started.set(deps, jobs);
    const mine = jobs;
    app.addHook('onClose', async () => {
      started.delete(deps);
      await (await mine).stop();
    });
  }
  return jobs;
}
