import { HttpTestingController } from '@angular/common/http/testing';
import { ChangeDetectionStrategy, Component, signal } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import fc from 'fast-check';
import { demoPistonTrainerContent } from '@shared/speed-book/demo-content';
import { STATED_DECIMALS, toCanonical, type StatedQuantity, type StatedUnits } from '@shared/speed-book/stated-units';
import { REVISION_PATHS } from '../speed-books/revisions-api';
import { RevisionEditor } from './revision-editor';
import { StatedUnitInput } from './stated-unit-input';
import { StatedUnitsContext } from './stated-units-context';
import { DRAFT_ID, setUpRevisionEditor, type RevisionEditorHarness } from './testing/revision-editor-harness';

// Material forms under jsdom on this machine take several seconds per test.
jest.setTimeout(60_000);

// Exact factors (international yard and pound agreement 1959; SI nautical mile of 1 852 m).
const KT_PER_MPH = 1609.344 / 1852;
const KG_PER_LB = 0.45359237;

@Component({
  imports: [ReactiveFormsModule, StatedUnitInput],
  providers: [StatedUnitsContext],
  template: `<input type="number" [formControl]="speed" swStatedUnit="speed" /><input type="number" [formControl]="weight" swStatedUnit="weight" />`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
class FigureHost {
  readonly speed = new FormControl<number | null>(null);
  readonly weight = new FormControl<number | null>(null);
}

describe('StatedUnitInput', () => {
  let fixture: ComponentFixture<FigureHost>;
  let units: ReturnType<typeof signal<StatedUnits>>;
  const inputs = () => fixture.nativeElement.querySelectorAll('input') as NodeListOf<HTMLInputElement>;

  beforeEach(async () => {
    fixture = TestBed.createComponent(FigureHost);
    units = fixture.debugElement.injector.get(StatedUnitsContext).units;
    await fixture.whenStable();
  });

  it('stores what is typed in mph as kt and shows it again in mph, in kt after a switch, without touching the control', async () => {
    units.set({ weight: 'lb', speed: 'mph' });
    await fixture.whenStable();
    const [speed] = Array.from(inputs());
    speed!.value = '161';
    speed!.dispatchEvent(new Event('input'));
    const stored = fixture.componentInstance.speed.value!;
    expect(stored).toBeCloseTo(161 * KT_PER_MPH, 12);

    units.set({ weight: 'lb', speed: 'kt' });
    await fixture.whenStable();
    expect(speed!.value).toBe('139.9052');
    expect(fixture.componentInstance.speed.value).toBe(stored);
    units.set({ weight: 'lb', speed: 'kmh' });
    await fixture.whenStable();
    expect(speed!.value).toBe('259.1044');
    units.set({ weight: 'lb', speed: 'mph' });
    await fixture.whenStable();
    expect(speed!.value).toBe('161');
    expect(fixture.componentInstance.speed.value).toBe(stored);

    speed!.value = '';
    speed!.dispatchEvent(new Event('input'));
    expect(fixture.componentInstance.speed.value).toBeNull();
  });

  it('gives back every figure typed in lb, mph or km/h after a save and load through JSON (fast-check)', async () => {
    const figure = fc.integer({ min: 1, max: 99_999_999 }).map((n) => n / 10 ** STATED_DECIMALS);
    const stated = fc.record({ weight: fc.constantFrom('kg' as const, 'lb' as const), speed: fc.constantFrom('kt' as const, 'mph' as const, 'kmh' as const) });
    await fc.assert(
      fc.asyncProperty(figure, stated, fc.constantFrom<StatedQuantity>('speed', 'weight'), async (typed, chosen, quantity) => {
        units.set(chosen);
        await fixture.whenStable();
        const [speedInput, weightInput] = Array.from(inputs());
        const input = quantity === 'speed' ? speedInput! : weightInput!;
        const control = quantity === 'speed' ? fixture.componentInstance.speed : fixture.componentInstance.weight;
        input.value = String(typed);
        input.dispatchEvent(new Event('input'));
        expect(control.value).toBe(toCanonical(typed, quantity, chosen));
        const saved = JSON.parse(JSON.stringify({ figure: control.value })) as { figure: number };
        control.setValue(null);
        control.setValue(saved.figure);
        expect(Number(input.value)).toBe(typed);
        expect(input.value).toBe(String(typed));
      }),
      { numRuns: 300 },
    );
  });
});

describe('RevisionEditor in the flight manual’s units', () => {
  let fixture: ComponentFixture<RevisionEditor>;
  let backend: HttpTestingController;
  let page: HTMLElement;

  let editor: RevisionEditorHarness;

  beforeEach(() => {
    editor = setUpRevisionEditor({ changeSummary: 'Trainer book from the 1968 owner’s manual (mph).' });
    ({ fixture, backend, page } = editor);
  });

  afterEach(() => backend.verify());

  const draft = (content: Record<string, unknown>) => editor.draft(content);

  async function openDraft(content: Record<string, unknown>): Promise<void> {
    await editor.openDraft(content, fixture);
  }

  const field = (path: string) => page.querySelector<HTMLInputElement>(`[data-path="${path}"]`)!;
  const label = (path: string) => field(path).closest('mat-form-field')!.querySelector('mat-label')!.textContent!.trim();

  async function type(path: string, value: string): Promise<void> {
    const input = field(path);
    input.value = value;
    input.dispatchEvent(new Event('input'));
    input.dispatchEvent(new Event('blur'));
    await fixture.whenStable();
  }

  async function save(): Promise<Record<string, unknown>> {
    page.querySelector('form')!.dispatchEvent(new Event('submit'));
    await fixture.whenStable();
    const patch = backend.expectOne({ method: 'PATCH', url: REVISION_PATHS.revision(DRAFT_ID) });
    const body = JSON.parse(JSON.stringify(patch.request.body)) as { content: Record<string, unknown> };
    patch.flush({ revision: draft(body.content) });
    await fixture.whenStable();
    return body.content;
  }

  it('takes a trainer book in lb and mph, stores kg and kt, and shows the same figures after saving and loading', async () => {
    const content = { ...demoPistonTrainerContent(), statedUnits: { weight: 'lb', speed: 'mph' } };
    await openDraft(content as unknown as Record<string, unknown>);
    expect(label('limits.vneKt')).toBe('VNE (mph)');
    expect(label('weights.maximumTakeoffKg')).toBe('Maximum takeoff weight (lb)');
    expect(page.querySelector('[data-testid="stated-units"]')).not.toBeNull();
    // The stored 1 100 kg of the demo shown in lb (1100 / 0.453 592 37 = 2425.0849…).
    expect(field('weights.maximumTakeoffKg').value).toBe('2425.0849');

    await type('weights.maximumTakeoffKg', '2550');
    await type('weights.maximumLandingKg', '2550');
    await type('limits.vneKt', '184');
    await type('configurations.0.positionError.0.iasKt', '46');
    const saved = await save();
    const weights = saved['weights'] as Record<string, number>;
    const limits = saved['limits'] as Record<string, number>;
    expect(saved['statedUnits']).toEqual({ weight: 'lb', speed: 'mph' });
    expect(weights['maximumTakeoffKg']).toBeCloseTo(2550 * KG_PER_LB, 9);
    expect(limits['vneKt']).toBeCloseTo(184 * KT_PER_MPH, 9);
    expect((saved['configurations'] as { positionError: { iasKt: number }[] }[])[0]!.positionError[0]!.iasKt).toBeCloseTo(46 * KT_PER_MPH, 9);

    // Loaded again from what was stored: the figures as typed.
    fixture.destroy();
    fixture = TestBed.createComponent(RevisionEditor);
    page = fixture.nativeElement;
    await openDraft(saved);
    expect(field('weights.maximumTakeoffKg').value).toBe('2550');
    expect(field('limits.vneKt').value).toBe('184');
    expect(field('configurations.0.positionError.0.iasKt').value).toBe('46');
  });

  it('says the schema’s sentences with the figures in the manual’s units, the stored ones beside', async () => {
    const content = { ...demoPistonTrainerContent(), statedUnits: { weight: 'lb', speed: 'mph' } };
    await openDraft(content as unknown as Record<string, unknown>);
    // Row 2 of the demo's flaps-up table is 60 kt = 69.05 mph; 40 mph = 34.76 kt (exact factors above).
    await type('configurations.0.positionError.2.iasKt', '40');
    expect(page.querySelector('[data-testid="problem-summary"]')!.textContent).toContain(
      'Flaps up › position-error row 3 › IAS (mph): The IAS column must increase strictly: 40 mph (34.76 kt) does not exceed 69.05 mph (60 kt) above it.',
    );
  });

  it('switching the units shows the stored figures converted and changes none of them', async () => {
    const content = demoPistonTrainerContent();
    await openDraft(content as unknown as Record<string, unknown>);
    expect(field('limits.vneKt').value).toBe(String(content.limits.vneKt));
    expect(label('limits.vneKt')).toBe('VNE (kt)');
    const speedUnit = (fixture.componentInstance as unknown as { form: { group: { controls: { statedUnits: { controls: { speed: FormControl<string> } } } } } }).form.group.controls.statedUnits.controls.speed;
    speedUnit.setValue('mph');
    await fixture.whenStable();
    expect(label('limits.vneKt')).toBe('VNE (mph)');
    expect(Number(field('limits.vneKt').value)).toBeCloseTo((content.limits.vneKt! * 1852) / 1609.344, 4);
    const saved = await save();
    expect((saved['limits'] as Record<string, number>)['vneKt']).toBe(content.limits.vneKt);
    expect(saved['weights']).toEqual(content.weights);
    expect(saved['configurations']).toEqual(content.configurations);
    expect(saved['statedUnits']).toEqual({ weight: 'kg', speed: 'mph' });
  });
});
