import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { CoveragePicture } from '../coverage/coverage-picture';
import { ENVELOPE_AXES, ENVELOPE_PHASES } from './envelope-form';
import { LiveCoverage } from './live-coverage';
import type { RevisionForm } from './revision-form';

const BOUNDS = [
  { bound: 'min', words: 'Lowest' },
  { bound: 'max', words: 'Highest' },
] as const;

/**
 * The editor's envelope proof: the envelope the book declares, whether its stall speeds are
 * reference stall speeds, the live coverage picture of the content being edited, and the
 * flight manual's reasons for the broken rules the engineer records as exceptions.
 */
@Component({
  selector: 'sw-envelope-coverage-section',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    CoveragePicture,
  ],
  templateUrl: './envelope-coverage-section.html',
  styleUrls: ['./revision-editor.scss', './envelope-coverage-section.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EnvelopeCoverageSection {
  protected readonly coverage = inject(LiveCoverage);

  readonly form = input.required<RevisionForm>();
  /** Content path → sentence, as the editor places them. */
  readonly problems = input.required<Readonly<Record<string, string>>>();

  protected readonly phases = ENVELOPE_PHASES;
  protected readonly axes = ENVELOPE_AXES;
  protected readonly bounds = BOUNDS;

  protected stateMessage(): string {
    const state = this.coverage.state();
    return 'message' in state ? state.message : '';
  }

  protected control(phase: (typeof ENVELOPE_PHASES)[number], axis: (typeof ENVELOPE_AXES)[number]['axis'], bound: 'min' | 'max') {
    return this.form().group.controls.envelope.controls[phase].controls[axis].controls[bound];
  }

  protected problemAt(path: string): string | undefined {
    return this.problems()[path];
  }

  /** Rules to choose from for exception `i`: the broken ones, plus whatever it names already. */
  protected ruleChoices(i: number): { ruleId: string; words: string }[] {
    const current = this.form().ruleExceptions.at(i)?.controls.ruleId.value ?? '';
    const taken = new Set(this.form().ruleExceptions.getRawValue().map((e, j) => (j === i ? '' : e.ruleId)));
    const choices = this.coverage
      .brokenRules()
      .filter((r) => !taken.has(r.ruleId))
      .map((r) => ({ ruleId: r.ruleId, words: `${r.title} (broken at ${r.brokenAt} ${r.brokenAt === 1 ? 'point' : 'points'})` }));
    if (current && !choices.some((c) => c.ruleId === current)) choices.push({ ruleId: current, words: `${current} (not broken in the last check)` });
    return choices;
  }

  protected canAddException(): boolean {
    const taken = new Set(this.form().ruleExceptions.getRawValue().map((e) => e.ruleId));
    return this.coverage.brokenRules().some((r) => !taken.has(r.ruleId)) && this.form().ruleExceptions.length < 20;
  }

  protected addException(): void {
    const taken = new Set(this.form().ruleExceptions.getRawValue().map((e) => e.ruleId));
    this.form().addRuleException(this.coverage.brokenRules().find((r) => !taken.has(r.ruleId))?.ruleId ?? '');
  }

  protected removeException(i: number): void {
    this.form().ruleExceptions.removeAt(i);
  }
}
