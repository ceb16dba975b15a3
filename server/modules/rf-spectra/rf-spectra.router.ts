/**
 * RF beat-spectrum routes, mounted at the API root (app.ts):
 *   POST   /benches/:benchId/rf-spectra   multipart (file + fields) (owner, analyst)
 *   GET    /benches/:benchId/rf-spectra   summaries (any member)
 *   GET    /rf-spectra/:id                one spectrum with its trace and fits (any member of its bench)
 *   DELETE /rf-spectra/:id                (owner, or the analyst who uploaded it)
 * The /benches/:benchId routes rely on app.ts's requireUser + loadBenchAccess; the role is checked before
 * the upload is read. The file is held in memory (a trace is small) and never stored as a file.
 */
import { Router, type NextFunction, type Request, type RequestHandler, type Response } from 'express';
import multer from 'multer';
import { RfSpectrumUploadFields, type RfSpectrumListResponse, type RfSpectrumResponse } from '../../contracts/rf-spectra';
import { AppError } from '../../errors';
import { routeParam } from '../../lib/route-param';
import { benchAccessOf } from '../../middleware/bench-access';
import { currentAuth, requireUser } from '../../middleware/session';
import { assertCaptureAction } from '../captures/capture-policy';
import type { RfSpectraService } from './rf-spectra.service';

/** Largest spectrum file accepted: 4 MiB (room for the 40 001 rows of RF_MAX_ROWS with long numbers). */
export const RF_MAX_FILE_BYTES = 4 * 1024 * 1024;

function receiveSpectrum(): RequestHandler {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: RF_MAX_FILE_BYTES, files: 1, fields: 20, fieldSize: 4096, parts: 24 },
  }).single('file');
  return (req: Request, res: Response, next: NextFunction) => {
    upload(req, res, (err?: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') return next(new AppError(413, 'payload_too_large', 'the spectrum file is larger than the 4 MiB limit'));
        return next(new AppError(400, 'validation_failed', 'send one file, in the form field "file"', [{ path: err.field ?? 'file', message: err.message }]));
      }
      next(err);
    });
  };
}

export function createRfSpectraRouter(rfSpectra: RfSpectraService): Router {
  const router = Router();

  router.post(
    '/benches/:benchId/rf-spectra',
    requireUser,
    (_req, res, next) => {
      assertCaptureAction(benchAccessOf(res), 'captures.write');
      next();
    },
    receiveSpectrum(),
    async (req, res) => {
      const file = req.file;
      if (!file) {
        throw new AppError(400, 'validation_failed', 'check this field: file', [
          { path: 'file', message: 'attach the spectrum (CSV) in the form field "file"' },
        ]);
      }
      const fields = RfSpectrumUploadFields.parse(req.body ?? {});
      const rfSpectrum = await rfSpectra.create(benchAccessOf(res), { buffer: file.buffer, originalName: file.originalname }, fields);
      res.status(201).json({ rfSpectrum } satisfies RfSpectrumResponse);
    },
  );

  router.get('/benches/:benchId/rf-spectra', requireUser, async (_req, res) => {
    res.json({ rfSpectra: await rfSpectra.list(benchAccessOf(res)) } satisfies RfSpectrumListResponse);
  });

  router.get('/rf-spectra/:id', requireUser, async (req, res) => {
    res.json({ rfSpectrum: await rfSpectra.get(currentAuth(res).user.id, routeParam(req, 'id')) } satisfies RfSpectrumResponse);
  });

  router.delete('/rf-spectra/:id', requireUser, async (req, res) => {
    await rfSpectra.remove(currentAuth(res).user.id, routeParam(req, 'id'));
    res.status(204).end();
  });

  return router;
}
