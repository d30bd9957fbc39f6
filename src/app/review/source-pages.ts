import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { DomSanitizer, type SafeResourceUrl } from '@angular/platform-browser';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { AttachmentView } from '@shared/api/attachments';

/** The flight-manual pages attached to a revision, one at a time, PDF in a frame or an image. */
@Component({
  selector: 'sw-source-pages',
  imports: [MatButtonModule, MatIconModule],
  template: `
    @if (attachments().length === 0) {
      <p class="muted" data-testid="no-sources">The author attached no source pages. Ask for them before publishing if the figures need checking.</p>
    } @else {
      <div class="choices" role="group" aria-label="Source pages">
        @for (attachment of attachments(); track attachment.id; let i = $index) {
          <button mat-stroked-button type="button" [class.chosen]="i === chosenIndex()" [attr.aria-pressed]="i === chosenIndex()" (click)="chooseSource(i)">
            <mat-icon>{{ attachment.contentType === 'application/pdf' ? 'picture_as_pdf' : 'image' }}</mat-icon>{{ attachment.originalName }}
          </button>
        }
      </div>
      @if (chosen(); as chosen) {
        @if (chosen.contentType === 'application/pdf') {
          <iframe class="page" [src]="chosenUrl()" [title]="'Source page ' + chosen.originalName" data-testid="source-frame"></iframe>
        } @else {
          <img class="page" [src]="chosen.url" [alt]="'Source page ' + chosen.originalName" data-testid="source-image" />
        }
        <a class="open" [href]="chosen.url" target="_blank" rel="noopener">Open {{ chosen.originalName }} in a new tab</a>
      }
    }
  `,
  styles: `
    :host {
      display: block;
    }
    .muted {
      color: var(--mat-sys-on-surface-variant);
    }
    .choices {
      display: flex;
      flex-wrap: wrap;
      gap: 8px;
      margin-bottom: 8px;
    }
    .chosen {
      background: var(--mat-sys-secondary-container);
      color: var(--mat-sys-on-secondary-container);
    }
    .page {
      display: block;
      width: 100%;
      height: 36rem;
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 8px;
      background: #fff;
    }
    img.page {
      height: auto;
      max-height: 48rem;
      object-fit: contain;
    }
    .open {
      display: inline-flex;
      align-items: center;
      min-height: 48px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SourcePages {
  private readonly sanitizer = inject(DomSanitizer);

  readonly attachments = input.required<readonly AttachmentView[]>();

  protected readonly chosenIndex = signal(0);
  protected readonly chosen = computed(() => this.attachments()[this.chosenIndex()] ?? this.attachments()[0] ?? null);
  /** Our own API's address for the file, which the server serves sandboxed. */
  protected readonly chosenUrl = computed<SafeResourceUrl | null>(() => {
    const chosen = this.chosen();
    return chosen && chosen.url.startsWith('/api/') ? this.sanitizer.bypassSecurityTrustResourceUrl(chosen.url) : null;
  });

  protected chooseSource(index: number): void {
    this.chosenIndex.set(index);
  }
}
