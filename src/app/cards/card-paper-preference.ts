import { DOCUMENT } from '@angular/common';
import { Injectable, inject } from '@angular/core';
import { isCardPaperSize, type CardPaperSize } from '@shared/card-pdf/page-sizes';

const KEY = 'speedwright.card-paper.';

/** The paper each person last printed on, remembered on this device (localStorage, by user id). */
@Injectable({ providedIn: 'root' })
export class CardPaperPreference {
  private readonly window = inject(DOCUMENT).defaultView;

  load(userId: number): CardPaperSize {
    try {
      const stored = this.window?.localStorage.getItem(KEY + userId);
      return isCardPaperSize(stored) ? stored : 'half-letter';
    } catch {
      return 'half-letter';
    }
  }

  save(userId: number, paper: CardPaperSize): void {
    try {
      this.window?.localStorage.setItem(KEY + userId, paper);
    } catch {
      // Storage blocked: the choice holds for this visit.
    }
  }
}
