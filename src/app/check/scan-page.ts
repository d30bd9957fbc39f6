import { DOCUMENT } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, ElementRef, afterNextRender, inject, signal, viewChild } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { Router } from '@angular/router';
import { fromEvent } from 'rxjs';
import { parseCheckUrl, type ParsedCheckUrl } from '@shared/card-check/check-url';
import { QrCamera } from './qr-camera';

export type CameraState = 'starting' | 'on' | 'off' | 'problem';

/**
 * `/scan`, open to everyone (anyone holding a printed card may check it; the page holds no
 * operator data): the camera reads the card's QR code and opens its check page; the code
 * printed on the card can be typed instead. The camera is released when a code is found, when
 * the page is hidden and when it is left.
 */
@Component({
  selector: 'sw-scan-page',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatIconModule],
  templateUrl: './scan-page.html',
  styleUrl: './scan-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ScanPage {
  private readonly router = inject(Router);
  private readonly document = inject(DOCUMENT);
  private readonly destroyRef = inject(DestroyRef);
  private readonly video = viewChild.required<ElementRef<HTMLVideoElement>>('video');
  private readonly canvas = viewChild.required<ElementRef<HTMLCanvasElement>>('canvas');
  private camera: QrCamera | null = null;

  protected readonly form = inject(NonNullableFormBuilder).group({ code: [''] });
  protected readonly typedProblem = signal<string | null>(null);
  protected readonly cameraState = signal<CameraState>('off');
  protected readonly cameraProblem = signal<string | null>(null);
  /** The last QR code seen that is not a card check of this site. */
  protected readonly scanProblem = signal<string | null>(null);
  /** A card of another Speedwright site: its check address, to open there. */
  protected readonly foreign = signal<{ origin: string; url: string } | null>(null);

  constructor() {
    afterNextRender(() => void this.startCamera());
    this.destroyRef.onDestroy(() => this.stopCamera());
    fromEvent(this.document, 'visibilitychange')
      .pipe(takeUntilDestroyed())
      .subscribe(() => {
        if (this.document.visibilityState === 'hidden') this.stopCamera();
      });
    this.form.controls.code.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => this.typedProblem.set(null));
  }

  /** Turns the camera on and scans until a card check code is seen. */
  protected async startCamera(): Promise<void> {
    this.stopCamera();
    this.cameraProblem.set(null);
    this.foreign.set(null);
    this.cameraState.set('starting');
    const camera = new QrCamera(this.video().nativeElement, this.canvas().nativeElement, this.document.defaultView?.navigator.mediaDevices);
    this.camera = camera;
    try {
      await camera.start((text) => this.readScanned(text));
      if (this.camera === camera && camera.running) this.cameraState.set('on');
    } catch (error) {
      if (this.camera !== camera) return;
      this.camera = null;
      this.cameraState.set('problem');
      this.cameraProblem.set(error instanceof Error ? error.message : String(error));
    }
  }

  /** Releases the camera (every track stopped). */
  protected stopCamera(): void {
    this.camera?.stop();
    this.camera = null;
    if (this.cameraState() !== 'problem') this.cameraState.set('off');
  }

  /** The check page of a typed code or a pasted check address. */
  protected checkTypedCode(): void {
    const parsed = parseCheckUrl(this.form.controls.code.value);
    if (!parsed.ok) {
      this.typedProblem.set(parsed.message);
      return;
    }
    this.openCheck(parsed.value);
  }

  /** Whether a scanned text ends the scan (a card check code, of this site or another). */
  private readScanned(text: string): boolean {
    const parsed = parseCheckUrl(text);
    if (!parsed.ok) {
      this.scanProblem.set(`This QR code is not a Speedwright card check. ${parsed.message}`);
      return false;
    }
    const here = this.document.defaultView?.location.origin;
    if (parsed.value.origin && here && parsed.value.origin !== here.toLowerCase()) {
      this.foreign.set({ origin: parsed.value.origin, url: text.trim() });
      this.cameraState.set('off');
      this.camera = null;
      return true;
    }
    this.camera = null;
    this.cameraState.set('off');
    this.openCheck(parsed.value);
    return true;
  }

  private openCheck(parsed: ParsedCheckUrl): void {
    this.stopCamera();
    void this.router.navigate(['/check', parsed.code], parsed.payloadText !== null ? { queryParams: { c: parsed.payloadText } } : {});
  }
}
