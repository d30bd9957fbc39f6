import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { AeroInputError } from '@shared/aero';
import { isaDeviationFromTat } from '@shared/card';
import { cardNumber } from './card-number-pipe';
import { parseTyped } from './card-form';

/**
 * The en-route ISA deviation from a total-air-temperature reading: TAT, pressure altitude and
 * Mach where it was read, through SAT = TAT / (1 + 0.2·K·M²) with the book's recovery factor
 * (shared/card/en-route-deviation.ts). Optional: the pilot may type the deviation directly.
 */
@Component({
  selector: 'sw-tat-deviation',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatButtonModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { class: 'tat-deviation' },
  template: `
    <p class="fine">Or from a TAT reading at cruise (recovery factor {{ recoveryWords() }}):</p>
    <div class="fields">
      <mat-form-field appearance="outline" subscriptSizing="dynamic">
        <mat-label>TAT (°C)</mat-label>
        <input matInput [formControl]="tat" inputmode="decimal" autocomplete="off" data-testid="input-tat" />
      </mat-form-field>
      <mat-form-field appearance="outline" subscriptSizing="dynamic">
        <mat-label>At pressure altitude (ft)</mat-label>
        <input matInput [formControl]="altitude" inputmode="decimal" autocomplete="off" data-testid="input-tat-altitude" />
      </mat-form-field>
      <mat-form-field appearance="outline" subscriptSizing="dynamic">
        <mat-label>At Mach</mat-label>
        <input matInput [formControl]="mach" inputmode="decimal" autocomplete="off" data-testid="input-tat-mach" />
      </mat-form-field>
    </div>
    @if (reading(); as r) {
      @if (r.ok) {
        <p class="fine" data-testid="tat-result">
          SAT {{ r.satWords }} °C, ISA {{ r.deviationWords }} °C there.
          <button mat-button type="button" data-testid="use-tat" (click)="useDeviation.emit(r.deviationC)">Use ISA {{ r.deviationWords }} °C en route</button>
        </p>
      } @else {
        <p class="fine" role="alert" data-testid="tat-problem">{{ r.sentence }}</p>
      }
    }
  `,
  styles: `
    .fields { display: flex; flex-wrap: wrap; gap: 8px 12px; }
    .fields mat-form-field { width: 11rem; }
  `,
})
export class TatDeviation {
  /** The book's `aircraft.tatRecoveryFactor`, or 1. */
  readonly recoveryFactor = input(1);
  /** The ISA deviation (°C, whole) to use en route. */
  readonly useDeviation = output<number>();

  protected readonly tat = new FormControl('', { nonNullable: true });
  protected readonly altitude = new FormControl('', { nonNullable: true });
  protected readonly mach = new FormControl('', { nonNullable: true });
  private readonly tatText = toSignal(this.tat.valueChanges, { initialValue: '' });
  private readonly altitudeText = toSignal(this.altitude.valueChanges, { initialValue: '' });
  private readonly machText = toSignal(this.mach.valueChanges, { initialValue: '' });

  protected readonly recoveryWords = computed(() => cardNumber(this.recoveryFactor(), 2));

  protected readonly reading = computed(() => {
    const texts = [this.tatText(), this.altitudeText(), this.machText()];
    if (texts.every((text) => text.trim() === '')) return null;
    const [tatC, pressureAltitudeFt, mach] = texts.map(parseTyped);
    if (tatC === null || pressureAltitudeFt === null || mach === null) {
      return { ok: false as const, sentence: 'Give the TAT in °C, the pressure altitude in ft and the Mach number where it was read, each as a number.' };
    }
    try {
      const { satC, isaDeviationC } = isaDeviationFromTat({ tatC, pressureAltitudeFt, mach, recoveryFactor: this.recoveryFactor() });
      const deviationC = Math.round(isaDeviationC) + 0;
      const signed = (value: number, decimals: number) => (value >= 0 ? '+' : '−') + cardNumber(Math.abs(value), decimals);
      return { ok: true as const, deviationC, satWords: signed(satC, 1).replace('+', ''), deviationWords: signed(deviationC, 0) };
    } catch (error) {
      if (!(error instanceof AeroInputError)) throw error;
      return { ok: false as const, sentence: error.message };
    }
  });
}
