import type { AppConfig } from '../config.js';
import type { Models } from '../models/index.js';
import { ApiKeyService } from './apiKeys.js';
import { AuditLog } from './audit.js';
import { AuthService } from './auth.js';
import { CaptureService } from './captures.js';
import { ComputePool } from './computePool.js';
import { ComputeService } from './computeService.js';
import { credentialEpoch } from './credentialEpoch.js';
import { InProcessJobQueue } from './inProcessJobQueue.js';
import type { JobQueue } from './jobQueue.js';
import { JobService } from './jobs.js';
import { PgBossJobQueue } from './pgBossJobQueue.js';
import { dialectOf } from '../db/database.js';
import { Mailer } from './mail.js';
import { ProjectService } from './projects.js';
import { StudyService } from './studies.js';
import { StudyShareService } from './studyShare.js';
import { TeamService } from './team.js';

/** Every service of one running app, wired to one database. */
export interface Services {
  models: Models;
  audit: AuditLog;
  auth: AuthService;
  apiKeys: ApiKeyService;
  mailer: Mailer;
  team: TeamService;
  projects: ProjectService;
  studies: StudyService;
  shares: StudyShareService;
  captures: CaptureService;
  /** The worker threads for compute (closed by JobService.close). */
  pool: ComputePool;
  compute: ComputeService;
  jobs: JobService;
}

/** The job queue for the database: pg-boss shared by the replicas on PostgreSQL, this process on SQLite. */
function jobQueueFor(models: Models, pool: ComputePool, config: AppConfig): JobQueue {
  const slots = config.compute.jobConcurrency;
  return dialectOf(config.databaseUrl) === 'postgres'
    ? new PgBossJobQueue(config.databaseUrl, models, pool, slots, config.jobQueue)
    : new InProcessJobQueue(models, pool, slots);
}

export function createServices(models: Models, config: AppConfig): Services {
  const audit = new AuditLog(models);
  const auth = new AuthService(
    models,
    audit,
    { sessionHours: config.sessionHours, bcryptRounds: config.bcryptRounds },
    credentialEpoch(models),
  );
  const mailer = new Mailer(models, config.smtpUrl, config.mailFrom, config.mailDir);
  const projects = new ProjectService(models, audit);
  const studies = new StudyService(models, audit, projects);
  const pool = new ComputePool(config.compute);
  const compute = new ComputeService(pool, config.compute);
  return {
    models,
    audit,
    auth,
    apiKeys: new ApiKeyService(models, audit),
    mailer,
    team: new TeamService(models, audit, auth, mailer, config.publicUrl),
    projects,
    studies,
    shares: new StudyShareService(models, audit, mailer, studies, compute, config.publicUrl),
    captures: new CaptureService(models, audit, projects, studies, compute),
    pool,
    compute,
    jobs: new JobService(models, audit, pool, config.compute, jobQueueFor(models, pool, config)),
  };
}
