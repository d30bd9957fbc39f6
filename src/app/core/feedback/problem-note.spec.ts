import { TestBed } from '@angular/core/testing';
import { ProblemNote } from './problem-note';

describe('ProblemNote', () => {
  it('announces the sentence at once, with an icon that repeats it and the test id on the sentence', async () => {
    const fixture = TestBed.createComponent(ProblemNote);
    fixture.componentRef.setInput('problem', 'This link has expired.');
    fixture.componentRef.setInput('icon', 'link_off');
    fixture.componentRef.setInput('testId', 'link-problem');
    await fixture.whenStable();
    const box = (fixture.nativeElement as HTMLElement).querySelector('[role="alert"]')!;
    expect(box.querySelector('mat-icon')?.textContent?.trim()).toBe('link_off');
    expect(box.querySelector('[data-testid="link-problem"]')?.textContent).toBe('This link has expired.');
  });

  it('shows the error icon unless told otherwise', async () => {
    const fixture = TestBed.createComponent(ProblemNote);
    fixture.componentRef.setInput('problem', 'The last day comes before the first.');
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).querySelector('mat-icon')?.textContent?.trim()).toBe('error');
  });
});
