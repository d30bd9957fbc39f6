import { NgTemplateOutlet } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import type { VerifyKnown } from '@shared/card-check/verify-api';
import { SAFETY_CAUTION } from '../app';
import { AuthService } from '../core/auth/auth-service';
import { cardNumber } from '../cards/card-number-pipe';
import { utcDate } from '@shared/card/card-presentation';
import { directionWords, windWords } from '@shared/card/card-wind-words';
import { SpeedCardView, type EnteredInput } from '../cards/speed-card-view';
import { runCardCheck, type CardCheckResult, type FiguresNote } from './card-check-flow';
import { CheckApi } from './check-api';
import { OfflineCheckData } from './offline-check-data';

/** How the page words a status: a short title and a sentence (our own wording). */
interface StatusWords {
  readonly tone: 'good' | 'bad' | 'unknown';
  readonly icon: string;
  readonly title: string;
  readonly sentence: string;
}

function statusWords(result: Extract<CardCheckResult, { kind: 'online' }>): StatusWords {
  const verify = result.verify;
  if (verify.status === 'unknown') {
    return {
      tone: 'unknown',
      icon: 'help',
      title: 'No card with this code here',
      sentence: `This Speedwright site issued no card with the code ${result.code.printedCode}. Compare the code with the card; a card printed by another operator’s Speedwright site can be checked only there.`,
    };
  }
  const revision = `Revision ${verify.revision.number}, published ${utcDate(verify.revision.publishedAt)},`;
  switch (verify.status) {
    case 'current':
      return { tone: 'good', icon: 'verified', title: 'Revision in force', sentence: `${revision} is still the revision in force for this airframe’s speed book.` };
    case 'superseded':
      return {
        tone: 'bad',
        icon: 'history',
        title: 'Replaced by a newer revision',
        sentence: `${revision} has been replaced by a newer revision since this card was issued. Do not use this card: prepare a new one from the revision in force.`,
      };
    case 'withdrawn':
      return {
        tone: 'bad',
        icon: 'block',
        title: 'Revision withdrawn',
        sentence: `${revision} was withdrawn by the operator: its figures may no longer be used. Do not use this card.`,
      };
  }
}

const OFFLINE_STATUS: Record<'published' | 'superseded' | 'withdrawn', string> = {
  published: 'the revision in force',
  superseded: 'already replaced by a newer revision',
  withdrawn: 'withdrawn by the operator',
};

/**
 * `/check/:code?c=…`, open to everyone: what a printed card's code says. Online it asks the
 * operator's site for the card's status and re-derives the figures of the code from the card's
 * revision; offline it uses what this device synced, and says what it cannot know.
 */
@Component({
  selector: 'sw-check-page',
  imports: [NgTemplateOutlet, RouterLink, MatIcon, MatProgressBar, SpeedCardView],
  templateUrl: './check-page.html',
  styleUrl: './check-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CheckPage {
  private readonly api = inject(CheckApi);
  private readonly auth = inject(AuthService);
  private readonly offline = inject(OfflineCheckData);

  /** The route's `:code` and its `?c=` payload (component input binding). */
  readonly code = input.required<string>();
  readonly c = input<string | undefined>();

  protected readonly caution = SAFETY_CAUTION;
  protected readonly result = signal<CardCheckResult | null>(null);
  protected readonly checking = signal(false);
  private run = 0;

  protected readonly online = computed(() => {
    const result = this.result();
    return result?.kind === 'online' ? result : null;
  });
  protected readonly offlineResult = computed(() => {
    const result = this.result();
    return result?.kind === 'offline' ? result : null;
  });
  protected readonly status = computed(() => {
    const online = this.online();
    return online ? statusWords(online) : null;
  });
  protected readonly known = computed<VerifyKnown | null>(() => {
    const verify = this.online()?.verify;
    return verify && verify.status !== 'unknown' ? verify : null;
  });
  protected readonly printedCode = computed(() => {
    const result = this.result();
    return result && result.kind !== 'invalid' ? result.code.printedCode : '';
  });
  protected readonly invalidMessage = computed(() => {
    const result = this.result();
    return result?.kind === 'invalid' ? result.message : '';
  });
  protected readonly failedMessage = computed(() => {
    const result = this.result();
    return result?.kind === 'failed' ? result.message : '';
  });
  protected readonly date = utcDate;
  protected readonly signature = computed(() => this.online()?.signature ?? null);
  protected readonly figures = computed<FiguresNote | null>(() => {
    const result = this.result();
    return result && (result.kind === 'online' || result.kind === 'offline') ? result.figures : null;
  });
  protected readonly figuresDiffer = computed(() => {
    const figures = this.figures();
    return figures?.kind === 'checked' && figures.check.outcome === 'differs';
  });
  protected readonly card = computed(() => {
    const figures = this.figures();
    return figures?.kind === 'checked' && figures.check.outcome === 'matches' ? figures.check.card : null;
  });
  protected readonly entered = computed<EnteredInput[]>(() => {
    const card = this.card();
    if (!card) return [];
    const { inputs } = card;
    const items: EnteredInput[] = [{ label: 'Takeoff weight', value: `${cardNumber(inputs.weightKg)} kg` }];
    if (inputs.landingWeightKg !== undefined) items.push({ label: 'Landing weight', value: `${cardNumber(inputs.landingWeightKg)} kg` });
    const aerodrome = (name: string, a: typeof inputs.departure) => {
      items.push({ label: `${name} elevation`, value: `${cardNumber(a.elevationFt)} ft` });
      items.push({ label: `${name} QNH`, value: `${cardNumber(a.qnhHpa)} hPa` });
      items.push({ label: `${name} OAT`, value: `${cardNumber(a.oatC)} °C` });
      if (a.dewPointC !== undefined) items.push({ label: `${name} dew point`, value: `${cardNumber(a.dewPointC)} °C` });
      if (a.wind && a.runwayHeadingDeg !== undefined) items.push({ label: `${name} wind`, value: `runway ${directionWords(a.runwayHeadingDeg)}, wind ${windWords(a.wind)}` });
    };
    aerodrome('Departure', inputs.departure);
    if (inputs.arrival) aerodrome('Arrival', inputs.arrival);
    items.push({ label: 'ISA deviation (en route)', value: `${cardNumber(inputs.isaDeviationC)} °C` });
    return items;
  });
  /** What the device knows offline, as sentences. */
  protected readonly offlineKnows = computed<string[]>(() => {
    const result = this.offlineResult();
    const data = result?.data;
    if (!result || !data) return [];
    const synced = data.lastSyncedAt ? `at its last sync, ${utcDate(data.lastSyncedAt)}` : 'when it last synced';
    const lines = [`This device’s data, ${synced}, shows revision ${data.revision.number} (published ${utcDate(data.revision.publishedAt)}) as ${OFFLINE_STATUS[data.revision.status]}.`];
    if (data.newer) {
      lines.push(`It already holds revision ${data.newer.number}, published ${utcDate(data.newer.publishedAt)}: this card’s revision is no longer in force. Do not use this card.`);
    }
    return lines;
  });
  protected readonly offlineCannotKnow = computed<string[]>(() => {
    const result = this.offlineResult();
    if (!result) return [];
    const issued = 'Whether a card was issued with this code at all: the card log is kept on the operator’s site.';
    if (!result.data) return ['Whether the revision this card was built from is still in force, replaced or withdrawn.', issued];
    const since = result.data.lastSyncedAt ? `since ${utcDate(result.data.lastSyncedAt)}` : 'since this device last synced';
    return [`Whether a newer revision was published, or this one withdrawn, ${since}.`, issued];
  });

  constructor() {
    effect(() => {
      const code = this.code();
      const payload = this.c() ?? null;
      void this.check(code, payload);
    });
  }

  /** Asks again (after the network came back, say). */
  protected checkAgain(): void {
    void this.check(this.code(), this.c() ?? null);
  }

  private async check(code: string, payload: string | null): Promise<void> {
    const run = ++this.run;
    this.checking.set(true);
    const result = await runCardCheck(
      {
        verify: (c) => this.api.verify(c),
        source: (c) => this.api.source(c),
        session: () => firstValueFrom(this.auth.session()),
        offline: this.offline,
      },
      code,
      payload,
    );
    if (run !== this.run) return;
    this.result.set(result);
    this.checking.set(false);
  }
}
