import { DOCUMENT } from '@angular/common';
import { Injectable, computed, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import type { SpeedCard } from '@shared/card';
import { checkUrl, formatCardCode } from '@shared/card-check';
import { CARD_PAPERS, CARD_PAPER_SIZES, cardChanges, cardPdf, previousCardOf, type CardPaperSize, type PreviousCard } from '@shared/card-pdf';
import { AuthService } from '../core/auth/auth-service';
import { utcDate } from '../core/format/display-format';
import { DeviceStore } from '../core/storage/device-store';
import { SyncService } from '../core/sync/sync-service';
import { CardFormModel } from './card-form-model';
import { CardLog } from './card-log';
import { CardPaperPreference } from './card-paper-preference';
import { CardPrintError, CardPrinter } from './card-printer';
import { CardRevisionSelection } from './card-revision-selection';
import { CardSources, cardContextOf, cardRevisionOf } from './card-sources';

/** What became of the last issue or print of a card, shown while that card is on screen. */
export interface CardActionResult {
  readonly digest: string;
  readonly sentence: string;
  readonly ok: boolean;
}

/**
 * The card page's issuing and printing (component-scoped: provided by `CardsPage`). Issuing
 * stores the card in the device's card log and sends it with the outbox (`CardLog`); printing
 * makes the kneeboard PDF on this device, issuing the card first when it is not issued yet. A
 * draft preview, a card from data past the currency limit, or an unconfirmed en-route ISA
 * deviation is neither issued nor printed.
 */
@Injectable()
export class CardIssuing {
  private readonly selection = inject(CardRevisionSelection);
  private readonly model = inject(CardFormModel);
  private readonly sources = inject(CardSources);
  private readonly sync = inject(SyncService);
  private readonly cardLog = inject(CardLog);
  private readonly printer = inject(CardPrinter);
  private readonly paperPreference = inject(CardPaperPreference);
  private readonly deviceStore = inject(DeviceStore);
  private readonly document = inject(DOCUMENT);
  private readonly user = inject(AuthService).user;

  readonly issuing = signal(false);
  private readonly issued = signal<(CardActionResult & { readonly entryId: string | null }) | null>(null);

  readonly paperSizes = CARD_PAPER_SIZES.map((size) => ({ size, label: CARD_PAPERS[size].label }));
  readonly paper = signal<CardPaperSize>('half-letter');
  readonly printing = signal(false);
  private readonly printed = signal<CardActionResult | null>(null);

  readonly issuedForThisCard = computed(() => {
    const issued = this.issued();
    return issued && issued.digest === this.model.card()?.digest ? issued : null;
  });

  readonly printedForThisCard = computed(() => {
    const printed = this.printed();
    return printed && printed.digest === this.model.card()?.digest ? printed : null;
  });

  constructor() {
    const user = this.user();
    if (user) this.paper.set(this.paperPreference.load(user.id));
    void this.cardLog.refresh();
  }

  async issueCard(): Promise<void> {
    const card = this.model.card();
    const user = this.user();
    if (!card || !user || this.selection.isDraft() || this.issuing() || this.selection.currencyRefusal() || this.model.needsIsaConfirmation()) return;
    this.issuing.set(true);
    try {
      const { entry, outcome } = await this.cardLog.issue(card, user);
      void this.sync.reload();
      const at = utcDate(entry.issuedAt);
      this.issued.set(
        outcome.problem === null
          ? { digest: card.digest, ok: true, entryId: entry.id, sentence: `Card issued at ${at} and recorded in the operator's card log.` }
          : { digest: card.digest, ok: false, entryId: entry.id, sentence: `Card issued at ${at} on this device. ${outcome.problem}` },
      );
    } catch {
      this.issued.set({ digest: card.digest, ok: false, entryId: null, sentence: 'This device could not store the card, so it was not issued. Check the browser allows site storage, then try again.' });
    } finally {
      this.issuing.set(false);
    }
  }

  choosePaper(paper: CardPaperSize): void {
    this.paper.set(paper);
    const user = this.user();
    if (user) this.paperPreference.save(user.id, paper);
  }

  /**
   * Prints the card on screen as a PDF. A printed card is an issued card: when this card is not
   * issued yet, printing issues it first (one card-log entry per card, however often it is
   * printed), so the paper carries the code the card log gave it.
   */
  async printCard(): Promise<void> {
    const card = this.model.card();
    const choice = this.selection.choice();
    const user = this.user();
    if (!card || !choice?.book || !user || this.selection.isDraft() || this.printing() || this.model.needsIsaConfirmation()) return;
    const refusal = this.selection.currencyRefusal();
    if (refusal) {
      this.printed.set({ digest: card.digest, ok: false, sentence: refusal });
      return;
    }
    this.printing.set(true);
    this.printed.set(null);
    try {
      if (this.issuedForThisCard()?.entryId == null) await this.issueCard();
      const issued = this.issuedForThisCard();
      if (!issued?.entryId) throw new CardPrintError(issued?.sentence ?? 'The card could not be issued, so it was not printed.');
      const entry = await this.deviceStore.db.cardLog.get(issued.entryId);
      const code = await this.cardLog.codeOf(issued.entryId);
      const context = cardContextOf(choice, user.operatorIsDemo);
      const previous = await this.previousCard(card, context);
      const issuedAt = entry?.issuedAt ?? new Date().toISOString();
      const { definition, fileName } = cardPdf({
        card,
        code: code ? formatCardCode(code) : null,
        checkUrl: code ? checkUrl(this.origin(), code, { revisionId: card.revision.id, inputs: card.inputs, digest: card.digest }) : null,
        issuedAt,
        dataAsOf: `${this.selection.dataAsOf() ?? `Data as of ${utcDate(issuedAt)}`}: revision ${card.revision.number} of ${card.speedBook.title}; printed ${utcDate(new Date().toISOString())}.`,
        changes: cardChanges(card, previous),
        paper: this.paper(),
      });
      await this.printer.download(definition, fileName);
      this.printed.set({
        digest: card.digest,
        ok: code !== null,
        sentence: code
          ? `${fileName} is ready: print it ${CARD_PAPERS[this.paper()].howToPrint}. Card code ${formatCardCode(code)}.`
          : `${fileName} is ready, without a check code: this card waits on the device until the card log records it. Print it again then, for a card anyone can check.`,
      });
    } catch (error) {
      const sentence = error instanceof CardPrintError ? error.message : 'The PDF could not be made on this device. Reload Speedwright and try again.';
      this.printed.set({ digest: card.digest, ok: false, sentence });
    } finally {
      this.printing.set(false);
    }
  }

  private origin(): string {
    return this.document.defaultView?.location.origin ?? '';
  }

  /** What the revision published before this card's gives for the same inputs (for the revision marks). */
  private async previousCard(card: SpeedCard, context: ReturnType<typeof cardContextOf>): Promise<PreviousCard> {
    // Revision numbers start at 1: the first revision has nothing before it.
    if (card.revision.number <= 1) return { kind: 'none' };
    const earlier = (candidates: { id: number; number: number }[]) => candidates.filter((r) => r.number < card.revision.number).sort((a, b) => b.number - a.number)[0];
    try {
      const stored = earlier(await this.deviceStore.db.revisions.where('speedBookId').equals(card.speedBook.id).toArray());
      if (stored) {
        const record = (await this.deviceStore.db.revisions.get(stored.id))!;
        return previousCardOf({ id: record.id, number: record.number, publishedAt: record.publishedAt, contentSha256: record.contentSha256, content: record.content }, card.inputs, context);
      }
    } catch {
      // No device store: ask the server.
    }
    try {
      const summaries = await firstValueFrom(this.sources.publishedRevisions(card.speedBook.id));
      const summary = earlier(summaries);
      if (!summary) return { kind: 'none' };
      return previousCardOf(cardRevisionOf(await firstValueFrom(this.sources.revision(summary.id))), card.inputs, context);
    } catch {
      return { kind: 'unavailable', revisionNumber: null };
    }
  }
}
