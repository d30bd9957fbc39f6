/**
 * The check URL survives a QR code: rendered to PNG with the qrcode package (ISO/IEC 18004
 * encoder), decoded back from the pixels with jsqr (an independent decoder) and compared.
 * pngjs (qrcode's own PNG dependency) reads the PNG into RGBA pixels.
 */
import jsQR from 'jsqr';
import QRCode from 'qrcode';
import { buildCard } from '../card/build-card';
import { HAND_CONTEXT, handPistonContent, handPistonInputs, revisionOf } from '../card/testing/test-fixtures';
import { generateCardCode } from './card-code';
import { checkUrl, parseCheckUrl } from './check-url';

const { PNG } = require('pngjs') as { PNG: { sync: { read(buffer: Buffer): { width: number; height: number; data: Buffer } } } };

const revision = revisionOf(handPistonContent());
const card = buildCard(revision, handPistonInputs(), HAND_CONTEXT);

async function roundTrip(text: string, options: QRCode.QRCodeToBufferOptions): Promise<string | undefined> {
  const png = PNG.sync.read(await QRCode.toBuffer(text, { type: 'png', ...options }));
  return jsQR(new Uint8ClampedArray(png.data.buffer, png.data.byteOffset, png.data.byteLength), png.width, png.height)?.data;
}

describe('the check URL in a QR code', () => {
  const url = checkUrl('https://cards.kestrel-fen.example', generateCardCode(), { revisionId: revision.id, inputs: card.inputs, digest: card.digest });

  it.each([
    ['error correction M, 4 px modules', { errorCorrectionLevel: 'M' as const, scale: 4, margin: 4 }],
    ['error correction Q, 2 px modules', { errorCorrectionLevel: 'Q' as const, scale: 2, margin: 4 }],
  ])('decodes back to the same URL (%s)', async (_what, options) => {
    const decoded = await roundTrip(url, options);
    expect(decoded).toBe(url);
    expect(parseCheckUrl(decoded!)).toMatchObject({ ok: true, value: { payload: { digest: card.digest, revisionId: revision.id } } });
  });

  it('fits a QR version of at most 8 at level M (49 × 49 modules, small on a kneeboard card)', () => {
    const qr = QRCode.create(url, { errorCorrectionLevel: 'M' });
    expect(qr.version).toBeLessThanOrEqual(8);
  });
});
