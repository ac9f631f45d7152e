import compression from 'compression';
import cookieParser from 'cookie-parser';
import express, { type Express } from 'express';
import helmet from 'helmet';
import path from 'node:path';
import type { AppContext } from './context';
import { acceptedBodies } from './middleware/content-type';
import { errorHandler, unknownApiRoute } from './middleware/error-handler';
import { initModels } from './models';
import { authRouter } from './routes/auth';
import { checkRouter } from './routes/check';
import { healthRouter } from './routes/health';
import { meRouter } from './routes/me';
import { schemaRouter } from './routes/schema';
import { workspacesRouter } from './routes/workspaces';
import { modelsRouter } from './routes/models';
import { revisionsRouter } from './routes/revisions';
import { compareRouter } from './routes/compare';
import { auditRouter } from './routes/audit';
import { teamRouter } from './routes/team';
import { invitationsRouter } from './routes/invitations';
import { passwordResetRouter } from './routes/password-reset';
import { outboxRouter } from './routes/outbox';
import { reviewsRouter } from './routes/reviews';
import { receiversRouter } from './routes/receivers';
import { fieldSheetRouter } from './routes/field-sheet';
import { accountRouter } from './routes/account';
import { portabilityRouter } from './routes/portability';
import { lineageRouter } from './routes/lineage';
import { clubRulesRouter } from './routes/club-rules';
import { corsIfConfigured } from './security/cors';
import { csrfGuard } from './security/csrf';

function securityHeaders(secure: boolean) {
  return helmet({
    contentSecurityPolicy: {
      useDefaults: true,
      directives: {
        defaultSrc: ["'self'"],
        scriptSrc: ["'self'"],
        // Inline styles only: the YAML editor (CodeMirror) writes its theme into <style>
        // elements at run time. Scripts stay 'self' alone.
        styleSrc: ["'self'", "'unsafe-inline'"],
        imgSrc: ["'self'", 'data:', 'blob:'],
        fontSrc: ["'self'", 'data:'],
        connectSrc: ["'self'"],
        objectSrc: ["'none'"],
        frameAncestors: ["'none'"],
        baseUri: ["'self'"],
        formAction: ["'self'"],
        // On plain http://127.0.0.1 an upgrade to https would break every asset.
        upgradeInsecureRequests: secure ? [] : null,
      },
    },
    strictTransportSecurity: secure,
  });
}

/** Serves the built client: hashed assets cached for good, every other path the SPA. */
function serveClient(app: Express, webDir: string): void {
  const root = path.resolve(webDir);
  app.use(
    '/assets',
    express.static(path.join(root, 'assets'), { immutable: true, maxAge: '1y', fallthrough: false, index: false }),
  );
  app.use(express.static(root, { index: false }));
  app.use((req, res, next) => {
    if (req.method !== 'GET' && req.method !== 'HEAD') return next();
    res.set('Cache-Control', 'no-cache');
    res.sendFile(path.join(root, 'index.html'), (error) => error && next(error));
  });
}

export function createApp(context: AppContext): Express {
  const { config } = context;
  initModels(context.sequelize);

  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', config.trustProxy);
  app.use(securityHeaders(config.cookieSecure));
  // gzip for answers over 1 KB when the client accepts it: a large compare's JSON
  // shrinks several times, which matters more on a pilot's phone link than the CPU.
  app.use(compression());

  const api = express.Router();
  const cors = corsIfConfigured(config.corsOrigins);
  if (cors) api.use(cors);
  api.use(csrfGuard({ trustedOrigins: config.corsOrigins }));
  api.use(acceptedBodies);
  api.use(express.json({ limit: config.jsonLimit }));
  api.use(cookieParser());
  api.use(healthRouter(context));
  api.use(checkRouter());
  api.use(schemaRouter());
  api.use(authRouter(context));
  api.use(meRouter(context));
  api.use(workspacesRouter(context));
  api.use(modelsRouter(context));
  api.use(revisionsRouter(context));
  api.use(compareRouter(context));
  api.use(lineageRouter(context));
  api.use(clubRulesRouter(context));
  api.use(auditRouter(context));
  api.use(teamRouter(context));
  api.use(invitationsRouter(context));
  api.use(passwordResetRouter(context));
  api.use(outboxRouter(context));
  api.use(reviewsRouter(context));
  api.use(receiversRouter(context));
  api.use(fieldSheetRouter(context));
  api.use(accountRouter(context));
  api.use(portabilityRouter(context));
  api.use(unknownApiRoute);
  app.use('/api', api);

  if (config.webDir) serveClient(app, config.webDir);
  app.use(errorHandler({ logErrors: config.logErrors }));
  return app;
}
