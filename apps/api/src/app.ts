import path from 'node:path';
import express, { type Express } from 'express';
import helmet from 'helmet';
import compression from 'compression';
import type pg from 'pg';
import type { ShelfPage, ShelfQuery } from '@scrap-relay/shared';
import { configurePassport } from './auth/passport.ts';
import { sessionMiddleware } from './auth/session.ts';
import type { AppContext } from './context.ts';
import { errorHandler, notFoundHandler, unauthenticated } from './errors/index.ts';
import { csrfProtection } from './middleware/csrf.ts';
import { requestLog } from './middleware/request-log.ts';
import { webApp } from './middleware/web-app.ts';
import { shelfPageBody } from './modules/bundles/shelf-pages.ts';
import { guildRoutes } from './modules/guild/guild.routes.ts';
import { healthRoutes } from './modules/health/health.routes.ts';
import { membersRoutes } from './modules/members/members.routes.ts';
import { sessionRoutes } from './modules/session/session.routes.ts';
import { bundlesRoutes } from './modules/bundles/bundles.routes.ts';
import { reviewRoutes } from './modules/review/review.routes.ts';
import { wishesRoutes } from './modules/wishes/wishes.routes.ts';
import { basketRoutes } from './modules/basket/basket.routes.ts';
import { ordersRoutes } from './modules/orders/orders.routes.ts';
import { webhookRoutes } from './modules/payments/webhook.routes.ts';
import { postageRoutes } from './modules/postage/postage.routes.ts';
import { ledgerRoutes } from './modules/ledger/ledger.routes.ts';
import { meetingsRoutes } from './modules/meetings/meetings.routes.ts';
import { profileRoutes } from './modules/members/profile.routes.ts';
import { starterRoutes } from './modules/starter/starter.routes.ts';
import { handoversRoutes } from './modules/handovers/handovers.routes.ts';
import { officeRoutes } from './modules/office/office.routes.ts';

/** Builds the HTTP app without listening, so tests drive it with supertest and server.ts serves it. */
export function createApp(ctx: AppContext, pool: pg.Pool): Express {
  const app = express();
  if (ctx.config.trustProxy) app.set('trust proxy', ctx.config.trustProxy);
  app.disable('x-powered-by');

  app.use(requestLog(ctx.logger));
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          styleSrc: ["'self'", "'unsafe-inline'"],
          scriptSrc: ["'self'"],
          formAction: ["'self'"],
          frameAncestors: ["'none'"],
          upgradeInsecureRequests: ctx.config.env === 'production' ? [] : null,
        },
      },
      hsts: ctx.config.env === 'production',
    }),
  );

  // Text answers (JSON, the built app's scripts and styles) go compressed; photos are already compressed.
  app.use(compression());

  const api = express.Router();
  api.use(healthRoutes(ctx));
  // Before the JSON parser: the signature is checked on the raw body.
  api.use(webhookRoutes(ctx));
  api.use(express.json({ limit: '100kb', strict: true }));
  const sessions = sessionMiddleware(ctx.config, pool);
  const passport = configurePassport();
  // No compatibility shim for passport 0.4-era strategies (req._passport): passport-local does not need it.
  const signedIn = [sessions, passport.initialize({ compat: false }), passport.session()];
  api.use(signedIn);
  api.use(csrfProtection(['/stripe/webhook']));
  api.use(sessionRoutes(ctx, pool));
  api.use(membersRoutes(ctx, pool));
  api.use(guildRoutes());
  api.use(reviewRoutes(ctx));
  api.use(bundlesRoutes(ctx));
  api.use(wishesRoutes());
  api.use(basketRoutes(ctx));
  api.use(postageRoutes());
  api.use(ordersRoutes(ctx));
  api.use(ledgerRoutes(ctx));
  api.use(meetingsRoutes(ctx));
  api.use(profileRoutes(ctx));
  api.use(officeRoutes(ctx));
  api.use(starterRoutes(ctx));
  api.use(handoversRoutes(ctx));
  api.use(notFoundHandler);
  app.use('/api', api);

  // Photos are for the guild's members, like the shelf: a signed-out request gets 401, whoever has the address.
  // They are written once under keys we make, so a member's browser keeps them for good, and no shared cache does.
  const uploads = express.Router();
  uploads.use(signedIn);
  uploads.use((req, _res, next) => next(req.user ? undefined : unauthenticated()));
  uploads.use(express.static(path.resolve(ctx.config.uploadDir), { index: false, fallthrough: false, setHeaders: privateForGood }));
  app.use('/uploads', uploads);

  if (ctx.config.webDist) {
    // Through the kept pages: the page looked up here is then ready for the app's own request for it.
    const shelfPage = async (query: ShelfQuery): Promise<ShelfPage> => {
      const { body } = await shelfPageBody(ctx, query, (text) => app.get('etag fn')?.(text, 'utf8'));
      return JSON.parse(body) as ShelfPage;
    };
    app.use(webApp(path.resolve(ctx.config.webDist), { signedIn, shelfPage, logger: ctx.logger }));
  }

  app.use(errorHandler);
  return app;
}

function privateForGood(res: express.Response) {
  res.setHeader('Cache-Control', 'private, max-age=31536000, immutable');
}
