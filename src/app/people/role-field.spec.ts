import { TestBed } from '@angular/core/testing';
import { FormControl } from '@angular/forms';
import { ROLE_SUMMARIES, type Role } from '@shared/auth/roles';
import { RoleField } from './role-field';

describe('RoleField', () => {
  async function fieldFor(control: FormControl<Role | null>) {
    const fixture = TestBed.createComponent(RoleField);
    fixture.componentRef.setInput('control', control);
    await fixture.whenStable();
    return { fixture, element: fixture.nativeElement as HTMLElement };
  }

  it('says under the field what the chosen role may do, and follows a new choice', async () => {
    const control = new FormControl<Role | null>('engineer');
    const { fixture, element } = await fieldFor(control);
    expect(element.querySelector('mat-hint')?.textContent).toBe(ROLE_SUMMARIES.engineer);
    control.setValue('approver');
    await fixture.whenStable();
    expect(element.querySelector('mat-hint')?.textContent).toBe(ROLE_SUMMARIES.approver);
  });

  it('gives no hint before a role is chosen, and the sentence it is given once the field is touched', async () => {
    const control = new FormControl<Role | null>(null, (c) => (c.value ? null : { schema: 'Choose the role this person will have.' }));
    const { fixture, element } = await fieldFor(control);
    expect(element.querySelector('mat-hint')).toBeNull();
    fixture.componentRef.setInput('message', 'Choose the role this person will have.');
    control.markAsTouched();
    await fixture.whenStable();
    expect(element.querySelector('mat-error')?.textContent).toBe('Choose the role this person will have.');
  });
});
