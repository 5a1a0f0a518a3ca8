import { Router, type Request, type RequestHandler, type Response } from 'express';
import { IIIF } from '@shared/api/routes';
import type { AppDeps } from '../app-deps';
import { requireRoles, signedInPerson } from '../auth/require-roles';
import { AppError, HTTP } from '../errors/app-error';
import { parseScanId } from '../scans/parse-scan-input';
import { seesWithdrawn } from '../scans/scans.routes';
import * as scansService from '../scans/scans.service';
import { scanHasSeriesLine } from '../series/series-membership';
import { INFO_MEDIA_TYPE } from './info-document';
import { PRESENTATION_MEDIA_TYPE } from './manifest-document';
import * as iiifService from './iiif.service';
import type { ImageRendering } from './iiif.service';
import { sendImage } from './image-rendering';

const SEE_OTHER = 303;
const NO_CONTENT = 204;

/** Sends JSON-LD under its profiled media type; a Buffer body keeps Express from adding a charset inside it. */
function sendJsonLd(res: Response, mediaType: string, document: unknown, cacheControl: string): void {
  res.set({ 'Content-Type': mediaType, 'Cache-Control': cacheControl }).send(Buffer.from(JSON.stringify(document), 'utf8'));
}

/**
 * IIIF Image 3.0 level 1 needs CORS (docs/references.md §7); viewers send the bearer token, so the preflight
 * must allow the Authorization header. Answers preflights before authentication.
 */
const iiifCors: RequestHandler = (req, res, next) => {
  res.set('Access-Control-Allow-Origin', '*');
  res.set('Access-Control-Allow-Headers', 'Authorization');
  res.set('Access-Control-Allow-Methods', 'GET, OPTIONS');
  // Helmet's same-origin default would stop other origins' viewers from showing the images.
  res.set('Cross-Origin-Resource-Policy', 'cross-origin');
  if (req.method === 'OPTIONS') {
    res.status(NO_CONTENT).end();
    return;
  }
  next();
};

/** Roles that work on scans and see every one they may catalogue. */
const SCAN_WORKER_ROLES = ['archivist', 'volunteer'] as const;

/** True when the caller reads images only as a climatologist (no archivist or volunteer role). */
function readsAsClimatologist(req: Request): boolean {
  const { roles } = signedInPerson(req.user);
  return !roles.some((role) => (SCAN_WORKER_ROLES as readonly string[]).includes(role));
}

/**
 * Mounted at /iiif, before the client fallback, with the bearer token. Archivists and volunteers read every
 * route; climatologists read the image routes (base, info.json, image requests) of the scans whose lines they
 * can see in a series: an approved line of a scan that is not withdrawn. Manifests and box collections
 * describe the catalogue, which is the archive's, so they stay with archivists and volunteers.
 */
export function iiifRoutes({ db, storage, config }: AppDeps, authenticate: RequestHandler, rendering: ImageRendering): Router {
  const router = Router();
  // Ids and manifests name the configured public base URL, never the request's Host header (which a caller can forge).
  const origin = config.publicUrl;
  const mayWorkOnScans = requireRoles(...SCAN_WORKER_ROLES);
  router.use(iiifCors, authenticate, requireRoles(...SCAN_WORKER_ROLES, 'climatologist'));
  // A withdrawn scan's images and manifest are hidden from volunteers as its catalogue entry is.
  router.param('scanId', async (req, _res, next, value: string) => {
    try {
      const scanId = parseScanId(value);
      if (readsAsClimatologist(req)) {
        await scansService.getScan(db, scanId, { hideWithdrawn: true });
        if (!(await scanHasSeriesLine(db, scanId))) {
          throw new AppError(HTTP.forbidden, 'forbidden', 'A climatologist may read the images of scans with an approved line in a station series only.');
        }
      } else {
        await scansService.getScan(db, scanId, { hideWithdrawn: !seesWithdrawn(req) });
      }
      next();
    } catch (error) {
      next(error);
    }
  });

  // §3 base URI: dereferencing it SHOULD give the info document, RECOMMENDED by a 303 (docs/references.md §7).
  router.get('/3/:scanId', (req, res) => {
    res.redirect(SEE_OTHER, IIIF.info(parseScanId(req.params.scanId)));
  });
  router.get('/3/:scanId/info.json', async (req, res) => {
    const scanId = parseScanId(req.params.scanId);
    const info = await iiifService.getInfoDocument(db, scanId, `${origin}${IIIF.imageBase(scanId)}`);
    sendJsonLd(res, INFO_MEDIA_TYPE, info, 'private, max-age=300');
  });
  router.get('/3/:scanId/manifest', mayWorkOnScans, async (req, res) => {
    const manifest = await iiifService.getManifest(db, parseScanId(req.params.scanId), origin);
    sendJsonLd(res, PRESENTATION_MEDIA_TYPE, manifest, 'private, no-cache');
  });
  router.get('/3/:scanId/:region/:size/:rotation/:qualityAndFormat', async (req, res) => {
    const { region, size, rotation, qualityAndFormat } = req.params;
    const image = await iiifService.getImage(db, storage, rendering, parseScanId(req.params.scanId), { region, size, rotation, qualityAndFormat });
    // Pixels of a page never change under their URL (masters are never rewritten).
    sendImage(res, image, 'private, max-age=86400');
  });
  router.get('/collection/box/:collection/:box', mayWorkOnScans, async (req: Request<{ collection: string; box: string }>, res: Response) => {
    const collection = await iiifService.getBoxCollection(db, req.params.collection, req.params.box, origin);
    sendJsonLd(res, PRESENTATION_MEDIA_TYPE, collection, 'private, no-cache');
  });
  return router;
}
