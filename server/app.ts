import express, { type Express } from 'express';
import { pinoHttp } from 'pino-http';
import type { AppDeps } from './app-deps';
import { apiTokensRoutes } from './api-tokens/api-tokens.routes';
import { authRoutes } from './auth/auth.routes';
import { createAuthenticateRead } from './auth/authenticate-read';
import { createAuthenticate, defaultStrategies } from './auth/authenticate';
import { chartFormsRoutes } from './chart-forms/chart-forms.routes';
import { errorHandler } from './errors/error-handler';
import { apiNotFound } from './errors/not-found';
import { followInkRoutes } from './follow-ink/follow-ink.routes';
import { healthRoutes } from './health/health.routes';
import { deskRoutes } from './desk/desk.routes';
import { clientStatic } from './http/client-static';
import { refuseNul } from './http/refuse-nul';
import { securityHeaders } from './http/security';
import { strictQuery } from './http/strict-query';
import { iiifRoutes } from './iiif/iiif.routes';
import { createImageRendering } from './iiif/image-rendering';
import { inkLinesRoutes, myInkLinesRoutes } from './ink-lines/ink-lines.routes';
import { instrumentsRoutes } from './instruments/instruments.routes';
import { intakeRoutes } from './intake/intake.routes';
import { createMailer } from './mail/mailer';
import { capturedMailsRoutes } from './mail/captured-mails.routes';
import { lessonsRoutes, noIndex, sharedLessonRoutes } from './lessons/lessons.routes';
import { invitationsRoutes } from './people/invitations.routes';
import { openApiRoutes } from './openapi/openapi.routes';
import { peopleRoutes } from './people/people.routes';
import { reviewRoutes } from './review/review.routes';
import { scansRoutes } from './scans/scans.routes';
import { seriesRoutes } from './series/series.routes';
import { stationsRoutes } from './stations/stations.routes';

export type { AppDeps } from './app-deps';

/** Body limit of ordinary JSON requests; the ink-line route has its own, larger one. */
export const JSON_BODY_LIMIT = '2mb';

/** Builds the Express app from its dependencies. Never listens: server.ts (or supertest) does. */
export function createApp(given: AppDeps): Express {
  const deps = { ...given, mailer: given.mailer ?? createMailer(given.config) };
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(pinoHttp({ logger: deps.logger, autoLogging: { ignore: (req) => req.url === '/api/health' } }));
  app.use(securityHeaders({ behindTls: deps.config.behindTls }));

  const rendering = createImageRendering(deps.storage, deps.config, deps.logger);
  const authenticate = createAuthenticate(defaultStrategies(deps.db, deps.config.jwtSecret));
  // The series, coverage and station reads also take API tokens (authenticate-read.ts).
  const authenticateRead = createAuthenticateRead(deps.db, authenticate);
  app.use(['/api', '/iiif'], strictQuery);
  app.use('/api/health', healthRoutes());
  // Before the app-wide JSON parser, which would refuse a long ink line.
  app.use('/api/scans', inkLinesRoutes(deps, authenticate));
  app.use(express.json({ limit: JSON_BODY_LIMIT }));
  app.use(refuseNul);
  app.use('/api/auth', authRoutes(deps, authenticate));
  app.use('/api/stations', authenticateRead, stationsRoutes(deps));
  app.use('/api/tokens', authenticate, apiTokensRoutes(deps));
  app.use('/api/instruments', authenticate, instrumentsRoutes(deps));
  app.use('/api/chart-forms', authenticate, chartFormsRoutes(deps));
  app.use('/api/intake', authenticate, intakeRoutes(deps));
  app.use('/api/scans', followInkRoutes(deps, authenticate));
  app.use('/api/scans', authenticate, scansRoutes(deps));
  app.use('/api/people', authenticate, peopleRoutes(deps));
  app.use('/api/invitations', authenticate, invitationsRoutes(deps));
  app.use('/api/lessons', authenticate, lessonsRoutes(deps, rendering));
  app.use('/api/ink-lines', authenticate, myInkLinesRoutes(deps));
  app.use('/api/shared', sharedLessonRoutes(deps, rendering));
  app.use('/api/dev/mails', authenticate, capturedMailsRoutes(deps));
  app.use('/api', seriesRoutes(deps, authenticateRead));
  app.use('/api', openApiRoutes());
  app.use('/api', reviewRoutes(deps, authenticate));
  app.use('/api', deskRoutes(deps, authenticate));
  app.use('/api', apiNotFound);
  app.use('/iiif', iiifRoutes(deps, authenticate, rendering));
  app.use('/iiif', apiNotFound);

  // The share page itself (the client's /shared/<token>) is kept out of search engines as its API answers are.
  app.use('/shared', noIndex);
  app.use(clientStatic(deps.config.clientDir, deps.logger));
  app.use(errorHandler(deps.logger, deps.config.maxUploadBytes));
  return app;
}
