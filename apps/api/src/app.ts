import type { Server } from 'node:http';
import express, { type Express } from 'express';
import * as OpenApiValidator from 'express-openapi-validator';
import multer from 'multer';
import swaggerUi from 'swagger-ui-express';
import { createAuthorizer } from './auth/authorize.js';
import { loadConfig, type ConfigOverrides } from './config.js';
import { openDatabase } from './db/database.js';
import { migrate } from './db/migrate.js';
import { cacheOpenApiMetadata } from './http/cacheOpenApiMetadata.js';
import { cacheRouteRegexps } from './http/cacheRouteRegexps.js';
import { HttpError } from './http/errors.js';
import { refuseMalformedPath } from './http/malformedPath.js';
import { securityHeaders } from './http/securityHeaders.js';
import { problemHandler } from './http/problemHandler.js';
import { rateLimitStores } from './http/rateLimitStores.js';
import { staticWeb } from './http/staticWeb.js';
import { defineModels } from './models/index.js';
import { listOperations, loadOpenApiDocument, type OpenApiDocument } from './openapi.js';
import { accountRoutes } from './routes/accountRoutes.js';
import { studyRoutes } from './routes/studyRoutes.js';
import { patternRoutes } from './routes/patternRoutes.js';
import { computeRoutes } from './routes/computeRoutes.js';
import { captureRoutes } from './routes/captureRoutes.js';
import { shareRoutes } from './routes/shareRoutes.js';
import { exportRoutes } from './routes/exportRoutes.js';
import { appServer, useOwnPrototypes } from './http/appServer.js';
import { createServices, type Services } from './services/index.js';
import { seedDemo } from './services/seed.js';

export { loadConfig, type AppConfig, type ConfigOverrides } from './config.js';

/**
 * A copy of the document for express-openapi-validator. Ajv's discriminator support (which
 * keeps errors to the chosen oneOf branch) refuses `mapping`, which openapi-typescript needs
 * to type the tag, so the copy drops the mappings; the tags are `const` in each branch anyway.
 */
function documentForValidator(document: OpenApiDocument): OpenApiDocument {
  const copy = structuredClone(document);
  const visit = (node: unknown): void => {
    if (Array.isArray(node)) node.forEach(visit);
    else if (node && typeof node === 'object') {
      const record = node as Record<string, unknown>;
      const discriminator = record.discriminator as Record<string, unknown> | undefined;
      if (discriminator && typeof discriminator === 'object') delete discriminator.mapping;
      Object.values(record).forEach(visit);
    }
  };
  visit(copy);
  return copy;
}

/** Largest accepted capture upload, in bytes. */
export const MAX_UPLOAD_BYTES = 5 * 1024 * 1024;

/** The Express app plus what a caller needs to shut it down and to look inside in tests. */
export type PulsewrightApp = Express & {
  services: Services;
  /** Whether this start created the database (and seeded it, when seeding is on). */
  freshDatabase: boolean;
  /** Stops background work and closes the database. */
  close(): Promise<void>;
  /**
   * A node:http server for the app, not yet listening, whose requests and responses are built
   * on the app's own prototypes (http/appServer.ts): src/index.ts listens on one.
   */
  httpServer(): Server;
};

/**
 * Builds the service: opens and migrates the database, seeds a new one, starts the job queue
 * (on SQLite it marks jobs a crash left running as failed), and assembles the middleware. It never listens; src/index.ts does.
 */
export async function createApp(overrides: ConfigOverrides = {}): Promise<PulsewrightApp> {
  const config = loadConfig(process.env, overrides);
  const document = loadOpenApiDocument();
  listOperations(document); // throws when an operation has no role requirement
  const sequelize = await openDatabase(config.databaseUrl);
  const { fresh } = await migrate(sequelize);
  const models = defineModels(sequelize);
  const services = createServices(models, config);
  await services.jobs.startQueue();
  if (fresh && config.seedDemo) await seedDemo(services, config.demoPassword);

  const app = express() as PulsewrightApp;
  const messageClasses = useOwnPrototypes(app);
  app.httpServer = () => appServer(app, messageClasses);
  app.disable('x-powered-by');
  // No ETag on answers: Express would hash every body (SHA-1 over a spectrum's 60 kB, each time)
  // to let a GET be answered 304, but the answers are computed per request or private to a bearer
  // token, and no client here sends If-None-Match. The dashboard's files keep theirs (staticWeb).
  app.set('etag', false);
  // Which proxies may name the client address (X-Forwarded-For); off unless TRUST_PROXY says so.
  app.set('trust proxy', config.trustProxy);
  // helmet's headers on every answer, taken from helmet once at start (http/securityHeaders.ts).
  app.use(securityHeaders());
  app.use(refuseMalformedPath);
  // No CORS headers: the dashboard is served from this origin, and scripts are not browsers.
  app.use('/api', express.json({ limit: '1mb' }));

  app.get('/api/openapi.json', (_req, res) => {
    res.json(document);
  });
  app.use(
    '/api/docs',
    swaggerUi.serve,
    swaggerUi.setup(document, { customSiteTitle: 'Pulsewright API' }),
  );

  cacheRouteRegexps();
  app.use(
    cacheOpenApiMetadata(
      OpenApiValidator.middleware({
        apiSpec: documentForValidator(document) as never,
        validateRequests: {
          allErrors: true,
          discriminator: true,
          allowUnknownQueryParameters: false,
        },
        validateResponses: config.validateResponses,
        validateSecurity: { handlers: { bearerAuth: createAuthorizer(services.auth) } },
        ignorePaths: (path: string) =>
          !path.startsWith('/api/') || path.startsWith('/api/docs') || path === '/api/openapi.json',
        fileUploader: {
          storage: multer.memoryStorage(),
          limits: { fileSize: MAX_UPLOAD_BYTES, files: 1, fields: 10 },
        },
      }),
    ),
  );
  const version = document.info.version;
  const rateLimits = rateLimitStores(config.databaseUrl, sequelize);
  // The compute routes first: they take most of the load, and Express tries each route in turn
  // (about 35 fewer path matches for a compute request). No path of one router is also matched,
  // for the same method, by a route of another, so the order changes nothing else.
  app.use(computeRoutes(services));
  app.use(accountRoutes(services, { ...config, version, rateLimits }));
  app.use(studyRoutes(services));
  app.use(patternRoutes(services));
  app.use(shareRoutes(services, { ...config, rateLimits }));
  app.use(captureRoutes(services));
  app.use(exportRoutes(services, { version }));
  app.use('/api', (req, _res, next) =>
    next(new HttpError(404, `No route ${req.method} ${req.originalUrl}.`)),
  );
  app.use(staticWeb(config.webDist));
  app.use(problemHandler(document, config.logErrors));

  await rateLimits.ready();

  app.services = services;
  app.freshDatabase = fresh;
  app.close = async () => {
    await services.jobs.close(); // and the compute pool
    await rateLimits.close();
    services.mailer.close();
    await sequelize.close();
  };
  return app;
}
