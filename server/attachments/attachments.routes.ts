import { Router } from 'express';
import type { Logger } from 'pino';
import { actorOf } from '../middleware/request-actor';
import { requireCapability } from '../middleware/authorize';
import { idParam } from '../middleware/id-param';
import { singleFileUpload } from '../uploads/single-file';
import { ATTACHMENT_MAX_BYTES, AttachmentStore } from './attachments.service';

/**
 * Source pages of revisions, mounted at `/api`:
 * `GET|POST /revisions/:id/attachments`, `GET|DELETE /attachments/:id`.
 */
export function attachmentsRoutes({ attachmentsDir, logger }: { attachmentsDir: string; logger?: Logger }): Router {
  const store = new AttachmentStore(attachmentsDir, logger);
  const router = Router();

  router.get('/revisions/:id/attachments', requireCapability('read-published'), async (req, res) => {
    const actor = actorOf(req);
    res.json({ attachments: await store.list(actor, idParam(req.params['id'], 'That revision')) });
  });

  router.post(
    '/revisions/:id/attachments',
    requireCapability('edit-speed-books'),
    // The type is decided by the content in the service; the browser's word is not asked.
    singleFileUpload({ maxBytes: ATTACHMENT_MAX_BYTES, maxLabel: '10 MB' }),
    async (req, res) => {
      const attachment = await store.add(actorOf(req), idParam(req.params['id'], 'That revision'), req.file!);
      res.status(201).json({ attachment });
    },
  );

  router.get('/attachments/:id', requireCapability('read-published'), async (req, res) => {
    const attachment = await store.find(actorOf(req), idParam(req.params['id'], 'That attachment'));
    res.set({
      'Content-Type': attachment.contentType,
      'Content-Disposition': contentDisposition(attachment.originalName),
      // Operator data: kept in no cache (the /api default, set again since sendFile would change it).
      'Cache-Control': 'no-store',
      ETag: `"${attachment.sha256}"`,
      // The file is shown, never run: no scripts even inside a PDF viewer's frame.
      'Content-Security-Policy': "default-src 'none'; img-src 'self'; style-src 'unsafe-inline'; sandbox",
    });
    // The path is ours (operator folder and random name), never the request's.
    res.sendFile(store.pathOf(attachment), { dotfiles: 'allow' }, (error) => {
      if (!error || res.headersSent) return;
      req.log?.error({ err: error, attachmentId: attachment.id }, 'attachment file could not be sent');
      res.status(410).json({ error: { code: 'file_missing', message: 'The file of this attachment is missing on the server.' } });
    });
  });

  router.delete('/attachments/:id', requireCapability('edit-speed-books'), async (req, res) => {
    await store.remove(actorOf(req), idParam(req.params['id'], 'That attachment'));
    res.status(204).end();
  });

  return router;
}

/** `inline` so PDFs and images open beside the diff; the name in both forms of RFC 6266. */
function contentDisposition(name: string): string {
  const ascii = name.replace(/[^\x20-\x7e]/g, '_').replace(/["\\]/g, '_');
  return `inline; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(name)}`;
}
