import type { AttachmentView } from '@shared/api/attachments';

/**
 * What a file is, from its first bytes (its "magic number"), never from its name or the type
 * the browser claims: a renamed program stays a program.
 * - PDF: starts with `%PDF-` and has the `%%EOF` marker in its last kilobyte (ISO 32000-1 §7.5);
 * - PNG: the 8-byte PNG signature, then the IHDR chunk, which must come first (PNG specification, §5.2 and §11.2.2);
 * - JPEG: the SOI marker FF D8 followed by the start of another marker, FF (ITU-T T.81, Annex B).
 */
export function detectAttachmentType(bytes: Buffer): AttachmentView['contentType'] | undefined {
  if (bytes.subarray(0, 5).toString('latin1') === '%PDF-' && bytes.subarray(-1024).toString('latin1').includes('%%EOF')) {
    return 'application/pdf';
  }
  const PNG = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  if (bytes.length > 16 && bytes.subarray(0, 8).equals(PNG) && bytes.subarray(12, 16).toString('latin1') === 'IHDR') return 'image/png';
  if (bytes.length > 3 && bytes[0] === 0xff && bytes[1] === 0xd8 && bytes[2] === 0xff) return 'image/jpeg';
  return undefined;
}
