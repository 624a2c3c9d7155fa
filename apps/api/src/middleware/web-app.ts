import fs from 'node:fs/promises';
import path from 'node:path';
import express, { type Request, type RequestHandler, type Response, type Router } from 'express';
import type { Logger } from 'pino';
import { CARD_PHOTO_SIZES, cardSrcSet, shelfPagePath, shelfQuerySchema, type BundleCard, type ShelfPage, type ShelfQuery } from '@scrap-relay/shared';
import { SESSION_COOKIE } from '../auth/session.ts';
import { readManifest, routeOnlyFiles } from './vite-manifest.ts';

export interface WebAppOptions {
  /** The session and passport middlewares, run only for a shelf address that comes with a session cookie. */
  signedIn: RequestHandler[];
  /** The page of bundles `GET /api/bundles` answers for a query. */
  shelfPage: (query: ShelfQuery) => Promise<ShelfPage>;
  logger: Logger;
}

/** The shelf's route module in the web app's build manifest (`loadShelfPage` in apps/web/src/app/first-page.ts). */
export const SHELF_ROUTE_MODULE = 'src/app/routes/app/shelf/shelf.tsx';
const SHELF_ADDRESS = /^\/shelf\/?$/;
const SESSION_LINK = '</api/session>; rel=preload; as=fetch; crossorigin';

/**
 * The built web app: hashed files cached for good, and `index.html` for every other address (the router in the
 * browser draws the page). The app's first request is always the session, so every page names it in its headers
 * (`Link: rel=preload`) and the browser asks for it beside the scripts rather than once they have run.
 *
 * A signed-in member's shelf gets a head start. On a slow connection the entry script takes most of a second,
 * and only then did the page ask for its route module, its bundles and the first card's photo (the page's largest
 * paint), one after another. Now the page's headers also name the bundles and the photo, and the
 * page itself names the route module's files after its own scripts (`<link rel="modulepreload">`), so all of them
 * travel beside the entry script. The addresses come from the same shared code the app uses (`shelfPagePath`,
 * `cardSrcSet`, `CARD_PHOTO_SIZES`) and from the build's manifest, so the browser's early copies are the ones the
 * page takes. A visitor who is not signed in gets the page alone and is sent to sign in by the app.
 */
export function webApp(dist: string, { signedIn, shelfPage, logger }: WebAppOptions): Router {
  const router = express.Router();
  const session = express.Router().use(signedIn);
  // A session that cannot be read (PostgreSQL restarting) costs only the head start: the page is still served,
  // and the app shows its own word about the service once it asks for the session itself.
  const withSession: RequestHandler = (req, res, next) => {
    if (!hasSessionCookie(req)) return next();
    session(req, res, (err?: unknown) => {
      if (err) logger.warn({ err }, 'could not read the session for the shelf page’s head start');
      next();
    });
  };
  const manifest = readManifest(dist);
  const shelfModules = manifest ? routeOnlyFiles(manifest, SHELF_ROUTE_MODULE) : [];
  const indexFile = path.join(dist, 'index.html');

  router.use(express.static(dist, { index: false, maxAge: '1y', immutable: true, setHeaders: noCacheForHtml }));
  router.get(SHELF_ADDRESS, withSession, async (req, res) => {
    if (!req.user) return sendApp(res, indexFile);
    try {
      res.setHeader('Link', [SESSION_LINK, ...(await shelfLinks(req, shelfPage))]);
    } catch (err) {
      res.setHeader('Link', SESSION_LINK);
      // The page still loads and asks for its bundles itself; only the head start is lost.
      logger.warn({ err }, 'could not name the shelf page’s first requests');
    }
    const html = await fs.readFile(indexFile, 'utf8');
    const modulePreloads = shelfModules.map((file) => `<link rel="modulepreload" crossorigin href="${file}">`).join('');
    res.set('Cache-Control', 'no-cache').type('html').send(html.replace('</head>', `${modulePreloads}</head>`));
  });
  router.get(/^(?!\/api\/).*/, (_req, res) => sendApp(res, indexFile));
  return router;
}

async function shelfLinks(req: Request, shelfPage: WebAppOptions['shelfPage']): Promise<string[]> {
  const address = new URL(req.originalUrl, 'http://shelf.invalid').searchParams;
  const request = shelfPagePath(address);
  // Read as `GET /api/bundles` reads its query, so the page found here is the page the app will be given.
  const query = shelfQuerySchema.parse(Object.fromEntries(new URL(request, 'http://shelf.invalid').searchParams));
  const first = (await shelfPage(query)).items[0];
  const links = [`</api${request}>; rel=preload; as=fetch; crossorigin`];
  if (first?.thumbUrl) links.push(photoLink(first.thumbUrl, first));
  return links;
}

function photoLink(thumbUrl: string, card: BundleCard): string {
  const srcSet = cardSrcSet(card);
  const choice = srcSet ? `; imagesrcset="${srcSet}"; imagesizes="${CARD_PHOTO_SIZES}"` : '';
  return `<${thumbUrl}>; rel=preload; as=image${choice}; fetchpriority=high`;
}

const hasSessionCookie = (req: Request) => (req.headers.cookie ?? '').split(';').some((c) => c.trimStart().startsWith(`${SESSION_COOKIE}=`));

function sendApp(res: Response, indexFile: string) {
  res.sendFile(indexFile, { headers: { 'Cache-Control': 'no-cache', Link: SESSION_LINK } });
}

function noCacheForHtml(res: Response, file: string) {
  if (file.endsWith('.html')) res.setHeader('Cache-Control', 'no-cache');
}
