import * as z from 'zod';

/** Source pages of a revision (`/api/revisions/:id/attachments`, `/api/attachments/:id`). */
export const ATTACHMENT_CONTENT_TYPES = ['application/pdf', 'image/png', 'image/jpeg'] as const;

export const attachmentSchema = z.object({
  id: z.number().int().positive(),
  revisionId: z.number().int().positive(),
  originalName: z.string(),
  contentType: z.enum(ATTACHMENT_CONTENT_TYPES),
  sizeBytes: z.number().int().nonnegative(),
  sha256: z.string().regex(/^[0-9a-f]{64}$/),
  uploadedBy: z.object({ id: z.number().int().positive(), displayName: z.string() }).nullable(),
  createdAt: z.string(),
  /** Where the file itself is served. */
  url: z.string(),
});
export type AttachmentView = z.infer<typeof attachmentSchema>;
export const attachmentResponseSchema = z.object({ attachment: attachmentSchema });
export const attachmentListSchema = z.object({ attachments: z.array(attachmentSchema) });
