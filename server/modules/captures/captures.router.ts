/**
 * Capture routes, mounted at the API root (app.ts):
 *   POST   /benches/:benchId/captures   multipart upload (owner, analyst)
 *   GET    /benches/:benchId/captures   list with filters and pages (any member)
 *   GET    /captures/:id                one capture with its analyses (any member of its bench)
 *   DELETE /captures/:id                file and rows together (owner, or the analyst who uploaded it)
 * The /benches/:benchId routes rely on app.ts's requireUser + loadBenchAccess for /benches/:benchId;
 * the role is checked before the upload is read, so a viewer's file is never stored.
 */
import { Router, type NextFunction, type Request, type RequestHandler, type Response } from 'express';
import multer from 'multer';
import { CaptureListQuery, CaptureUploadFields, type CaptureListResponse } from '../../contracts/captures';
import { AppError } from '../../errors';
import { routeParam } from '../../lib/route-param';
import { benchAccessOf } from '../../middleware/bench-access';
import { currentAuth, requireUser } from '../../middleware/session';
import type { Storage } from '../../storage/storage';
import { assertCaptureAction, type CaptureAction } from './capture-policy';
import type { CapturesService } from './captures.service';
import { receivedFileOf, uploadStorageEngine } from './upload-storage-engine';

export interface CapturesRouterDeps {
  captures: CapturesService;
  storage: Storage;
  /** PHASELOOM_MAX_UPLOAD_BYTES */
  maxUploadBytes: number;
}

/** 2147483648 → "2 GiB", 1536 → "1.5 KiB", 100 → "100 bytes". */
export function formatByteLimit(bytes: number): string {
  const units = ['bytes', 'KiB', 'MiB', 'GiB', 'TiB'];
  let value = bytes;
  let unit = 0;
  while (value >= 1024 && unit < units.length - 1) {
    value /= 1024;
    unit++;
  }
  const shown = Number.isInteger(value) ? String(value) : value.toFixed(1).replace(/\.0$/, '');
  return `${shown} ${units[unit]}`;
}

function allowCapture(action: CaptureAction): RequestHandler {
  return (_req, res, next) => {
    assertCaptureAction(benchAccessOf(res), action);
    next();
  };
}

/** multer with our storage engine; its limit and part errors become clear API errors. */
function receiveUpload(deps: CapturesRouterDeps): RequestHandler {
  const upload = multer({
    storage: uploadStorageEngine(deps.storage),
    limits: { fileSize: deps.maxUploadBytes, files: 1, fields: 40, fieldSize: 64 * 1024, parts: 48 },
  }).single('file');
  return (req: Request, res: Response, next: NextFunction) => {
    upload(req, res, (err?: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') {
          return next(
            new AppError(413, 'payload_too_large', `the file is larger than the ${formatByteLimit(deps.maxUploadBytes)} upload limit`),
          );
        }
        if (err.code === 'LIMIT_UNEXPECTED_FILE' || err.code === 'LIMIT_FILE_COUNT') {
          return next(
            new AppError(400, 'validation_failed', 'send one file, in the form field "file"', [
              { path: err.field ?? 'file', message: 'unexpected file field' },
            ]),
          );
        }
      }
      next(err);
    });
  };
}

export function createCapturesRouter(deps: CapturesRouterDeps): Router {
  const { captures, storage } = deps;
  const router = Router();

  router.post('/benches/:benchId/captures', requireUser, allowCapture('captures.write'), receiveUpload(deps), async (req, res) => {
    const file = receivedFileOf(req);
    if (!file) {
      throw new AppError(400, 'validation_failed', 'check this field: file', [
        { path: 'file', message: 'attach the capture file in the form field "file"' },
      ]);
    }
    let fields;
    try {
      fields = CaptureUploadFields.parse(req.body ?? {});
    } catch (e) {
      await storage.delete(file.tempKey).catch(() => {});
      throw e;
    }
    const reply = await captures.create(benchAccessOf(res), file, fields);
    res.status(201).json(reply);
  });

  router.get('/benches/:benchId/captures', requireUser, allowCapture('captures.read'), async (req, res) => {
    const query = CaptureListQuery.parse(req.query);
    res.json((await captures.list(benchAccessOf(res), query)) satisfies CaptureListResponse);
  });

  router.get('/captures/:id', requireUser, async (req, res) => {
    res.json(await captures.get(currentAuth(res).user.id, routeParam(req, 'id')));
  });

  router.delete('/captures/:id', requireUser, async (req, res) => {
    await captures.remove(currentAuth(res).user.id, routeParam(req, 'id'));
    res.status(204).end();
  });

  return router;
}
