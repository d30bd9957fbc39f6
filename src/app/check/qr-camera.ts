/**
 * Reads QR codes from the device camera: getUserMedia frames drawn on a canvas, each decoded
 * with jsqr. Always releases the camera (every track stopped) on `stop()`, which the scan page
 * calls when it is left, hidden, or has found a code.
 */
import jsQR from 'jsqr';

/** Why the camera gives no picture, as a sentence for the person holding the device. */
export function cameraProblem(error: unknown): string {
  const name = (error as { name?: string } | null)?.name ?? '';
  switch (name) {
    case 'NotAllowedError':
    case 'SecurityError':
      return 'Camera access was refused. Allow the camera for this site in the browser’s settings and try again, or type the code printed on the card.';
    case 'NotFoundError':
    case 'OverconstrainedError':
      return 'This device has no camera Speedwright can use. Type the code printed on the card.';
    case 'NotReadableError':
    case 'AbortError':
      return 'The camera is busy or not responding (another app may be using it). Close that app and try again, or type the code.';
    default:
      return 'The camera could not be started. Try again, or type the code printed on the card.';
  }
}

export const NO_CAMERA_API =
  'This browser gives this page no camera: it needs a secure (https) address of the operator’s Speedwright site, or a browser that allows cameras. Type the code printed on the card.';

/** Widest frame decoded, px: enough for a card's QR code at arm's length, cheap per frame. */
const MAX_DECODE_WIDTH = 640;

export class QrCamera {
  private stream: MediaStream | null = null;
  private frame = 0;
  private stopped = false;

  constructor(
    private readonly video: HTMLVideoElement,
    private readonly canvas: HTMLCanvasElement,
    private readonly mediaDevices: MediaDevices | undefined,
  ) {}

  /**
   * Starts the camera (the rear one where there is a choice) and calls `found` with the text of
   * the first QR code seen; `found` returns true to stop scanning. Rejects with a sentence.
   */
  async start(found: (text: string) => boolean): Promise<void> {
    if (!this.mediaDevices?.getUserMedia) throw new Error(NO_CAMERA_API);
    let stream: MediaStream;
    try {
      stream = await this.mediaDevices.getUserMedia({ video: { facingMode: { ideal: 'environment' } }, audio: false });
    } catch (error) {
      throw new Error(cameraProblem(error));
    }
    if (this.stopped) {
      // Left while the permission prompt was open: release at once.
      stream.getTracks().forEach((track) => track.stop());
      return;
    }
    this.stream = stream;
    this.video.srcObject = stream;
    this.video.setAttribute('playsinline', '');
    this.video.muted = true;
    await this.video.play().catch(() => undefined);
    const context = this.canvas.getContext('2d', { willReadFrequently: true });
    if (!context) {
      this.stop();
      throw new Error('This browser cannot read camera pictures. Type the code printed on the card.');
    }
    const scan = () => {
      if (this.stopped) return;
      const { videoWidth, videoHeight } = this.video;
      if (videoWidth > 0 && videoHeight > 0) {
        const scale = Math.min(1, MAX_DECODE_WIDTH / videoWidth);
        const width = Math.round(videoWidth * scale);
        const height = Math.round(videoHeight * scale);
        if (this.canvas.width !== width) this.canvas.width = width;
        if (this.canvas.height !== height) this.canvas.height = height;
        context.drawImage(this.video, 0, 0, width, height);
        const code = jsQR(context.getImageData(0, 0, width, height).data, width, height, { inversionAttempts: 'dontInvert' });
        if (code && code.data && found(code.data)) {
          this.stop();
          return;
        }
      }
      this.frame = requestAnimationFrame(scan);
    };
    this.frame = requestAnimationFrame(scan);
  }

  /** Whether the camera is on. */
  get running(): boolean {
    return this.stream !== null && !this.stopped;
  }

  /** Stops scanning and every track of the camera; safe to call more than once. */
  stop(): void {
    this.stopped = true;
    cancelAnimationFrame(this.frame);
    this.stream?.getTracks().forEach((track) => track.stop());
    this.stream = null;
    this.video.srcObject = null;
  }
}
