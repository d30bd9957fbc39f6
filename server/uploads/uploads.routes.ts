import { Router } from 'express';
import { DomainError } from '../errors/domain-error';
import { requireCapability } from '../middleware/authorize';
import { singleFileUpload } from './single-file';
import { parseSpeedTableCsv } from './speed-table-csv';

export const SPEED_TABLE_MAX_BYTES = 256 * 1024;

/** Browsers label CSV files in several ways; Windows often says vnd.ms-excel. */
const CSV_TYPES = new Set(['text/csv', 'application/csv', 'text/plain', 'application/vnd.ms-excel', 'text/comma-separated-values']);

/**
 * `/api/uploads`: files read for a preview and never stored. `POST /speed-table` takes one
 * CSV in either of our layouts (see speed-table-csv.ts) and answers the parsed structure with
 * row-level errors; the engineer then accepts the preview into a draft.
 */
export function uploadsRoutes(): Router {
  const router = Router();
  router.post(
    '/speed-table',
    requireCapability('edit-speed-books'),
    singleFileUpload({
      maxBytes: SPEED_TABLE_MAX_BYTES,
      maxLabel: '256 kB',
      acceptType: (mimetype, name) => CSV_TYPES.has(mimetype) || (mimetype === 'application/octet-stream' && /\.csv$/i.test(name)),
      typeMessage: 'Upload a CSV file (comma-separated values, saved as text).',
    }),
    (req, res) => {
      const text = decodeUtf8(req.file!.buffer);
      res.set('Cache-Control', 'no-store').json(parseSpeedTableCsv(text));
    },
  );
  return router;
}

function decodeUtf8(buffer: Buffer): string {
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(buffer);
  } catch {
    throw new DomainError('refused', 'unusable_csv', 'The file is not UTF-8 text. Save the table as "CSV UTF-8" and upload it again.', {
      file: 'Not UTF-8 text.',
    });
  }
}
