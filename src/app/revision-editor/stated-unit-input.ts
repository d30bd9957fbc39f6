import { Directive, ElementRef, Renderer2, computed, effect, forwardRef, inject, input, untracked } from '@angular/core';
import { NG_VALUE_ACCESSOR, type ControlValueAccessor } from '@angular/forms';
import { CANONICAL_UNITS, STATED_DECIMALS, fromCanonical, roundTo, toCanonical, type StatedQuantity } from '@shared/speed-book/stated-units';
import { StatedUnitsContext } from './stated-units-context';

/**
 * A number field whose control holds the stored figure (kg or kt) while the engineer types and
 * reads it in the flight manual's stated unit (lb, mph, km/h…), from `StatedUnitsContext`.
 * Switching the stated units shows the same stored figure converted and never writes the
 * control; a figure typed with up to four decimals is shown again exactly as typed after saving
 * and loading (see `shared/speed-book/stated-units.ts`). Use on `<input type="number">` with
 * `formControlName` or `[formControl]`: `<input type="number" formControlName="vneKt" swStatedUnit="speed" />`.
 */
@Directive({
  selector: 'input[swStatedUnit]',
  providers: [{ provide: NG_VALUE_ACCESSOR, useExisting: forwardRef(() => StatedUnitInput), multi: true }],
  // step "any": a converted figure such as 161.1079 mph is as valid as a whole one.
  host: { '(input)': 'typed()', '(blur)': 'onTouched()', step: 'any' },
})
export class StatedUnitInput implements ControlValueAccessor {
  /** What the field holds: a weight or a speed. */
  readonly quantity = input<StatedQuantity>('speed', { alias: 'swStatedUnit' });

  private readonly element = inject<ElementRef<HTMLInputElement>>(ElementRef).nativeElement;
  private readonly renderer = inject(Renderer2);
  private readonly context = inject(StatedUnitsContext, { optional: true });
  private readonly units = computed(() => this.context?.units() ?? CANONICAL_UNITS);

  /** The control's value: the figure in kg or kt, or null when the field is empty. */
  private stored: number | null = null;
  private onChange: (value: number | null) => void = () => undefined;
  protected onTouched: () => void = () => undefined;

  constructor() {
    // A change of stated units shows the stored figure anew; the control keeps its value.
    effect(() => {
      this.units();
      this.quantity();
      untracked(() => this.show());
    });
  }

  writeValue(value: unknown): void {
    this.stored = typeof value === 'number' && Number.isFinite(value) ? value : null;
    this.show();
  }

  registerOnChange(fn: (value: number | null) => void): void {
    this.onChange = fn;
  }

  registerOnTouched(fn: () => void): void {
    this.onTouched = fn;
  }

  setDisabledState(disabled: boolean): void {
    this.renderer.setProperty(this.element, 'disabled', disabled);
  }

  /** What the engineer typed, in the stated unit, stored canonical. An unreadable entry reads as empty, as Angular's number fields do. */
  protected typed(): void {
    const text = this.element.value.trim();
    const figure = text === '' ? Number.NaN : Number(text);
    this.stored = Number.isFinite(figure) ? toCanonical(figure, this.quantity(), this.units()) : null;
    this.onChange(this.stored);
  }

  private show(): void {
    // Rounded for showing only (kt too, after a switch from mph); the control keeps the stored figure.
    const text = this.stored === null ? '' : String(roundTo(fromCanonical(this.stored, this.quantity(), this.units()), STATED_DECIMALS));
    if (this.element.value !== text) this.renderer.setProperty(this.element, 'value', text);
  }
}
