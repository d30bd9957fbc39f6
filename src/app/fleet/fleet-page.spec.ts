import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { AircraftTypeView, AirframeView } from '@shared/api/fleet';
import { SessionUser } from '@shared/api/auth';
import { Role } from '@shared/auth/roles';
import { API_PATHS } from '../core/api/api-paths';
import { AuthService } from '../core/auth/auth-service';
import { FleetPage } from './fleet-page';

const stamp = '2026-11-01T00:00:00.000Z';
const types: AircraftTypeView[] = [
  { id: 1, designator: 'ZZP1', name: 'Kestrel trainer', category: 'piston-single', engines: 1, ceilingFt: 14000, createdAt: stamp, updatedAt: stamp },
  { id: 2, designator: 'ZZT2', name: 'Fen twin turboprop', category: 'turboprop', engines: 2, ceilingFt: 30000, createdAt: stamp, updatedAt: stamp },
];
const airframes: AirframeView[] = [
  { id: 11, registration: 'ZZ-KFB', serial: 'KT-102', aircraftTypeId: 1, active: true, createdAt: stamp, updatedAt: stamp },
  { id: 12, registration: 'ZZ-KFA', serial: 'KT-101', aircraftTypeId: 1, active: false, createdAt: stamp, updatedAt: stamp },
  { id: 13, registration: 'ZZ-KFT', serial: 'FT-7', aircraftTypeId: 2, active: true, createdAt: stamp, updatedAt: stamp },
];

function personWith(role: Role): SessionUser {
  return { id: 1, email: `${role}@demo.example`, displayName: 'Robin Aldane', role, operatorId: 1, operatorName: 'Kestrel Fen Aviation (demo)', operatorIsDemo: true };
}

describe('FleetPage', () => {
  let fixture: ComponentFixture<FleetPage>;
  let backend: HttpTestingController;
  let page: HTMLElement;

  async function open(role: Role): Promise<void> {
    TestBed.configureTestingModule({
      imports: [FleetPage],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
        { provide: AuthService, useValue: { user: signal(personWith(role)) } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(FleetPage);
    page = fixture.nativeElement;
    await fixture.whenStable();
  }

  async function answerLists(): Promise<void> {
    backend.expectOne(API_PATHS.aircraftTypes).flush({ aircraftTypes: types });
    backend.expectOne(API_PATHS.airframes).flush({ airframes });
    await fixture.whenStable();
  }

  afterEach(() => backend.verify());

  function registrations(): string[] {
    return Array.from(page.querySelectorAll('sw-airframes-table td.registration')).map((cell) => cell.textContent!.trim());
  }

  function button(root: ParentNode, text: string): HTMLButtonElement | undefined {
    return Array.from(root.querySelectorAll('button')).find((b) => b.textContent?.includes(text));
  }

  function overlay(): HTMLElement {
    return document.querySelector('.cdk-overlay-container') as HTMLElement;
  }

  async function type(input: HTMLInputElement, value: string): Promise<void> {
    input.value = value;
    input.dispatchEvent(new Event('input'));
    await fixture.whenStable();
  }

  it('lists airframes by registration with their type and state, and says how many', async () => {
    await open('pilot');
    await answerLists();
    expect(registrations()).toEqual(['ZZ-KFA', 'ZZ-KFB', 'ZZ-KFT']);
    const firstRow = Array.from(page.querySelectorAll('sw-airframes-table tr.mat-mdc-row')[0].querySelectorAll('td')).map((td) =>
      td.textContent!.replace(/\s+/g, ' ').trim(),
    );
    expect(firstRow).toEqual(['ZZ-KFA', 'KT-101', 'ZZP1 · Kestrel trainer', 'block Inactive']);
    expect(page.querySelector('[data-testid="airframes-count"]')?.textContent?.trim()).toBe('3 airframes');
  });

  it('filters airframes by type, serial or state, and says when nothing matches', async () => {
    await open('pilot');
    await answerLists();
    const filter = page.querySelector('sw-airframes-table input[type="search"]') as HTMLInputElement;

    await type(filter, 'kt-10');
    expect(registrations()).toEqual(['ZZ-KFA', 'ZZ-KFB']);
    await type(filter, 'fen twin');
    expect(registrations()).toEqual(['ZZ-KFT']);
    expect(page.querySelector('[data-testid="airframes-count"]')?.textContent?.trim()).toBe('1 of 3 airframes match');
    await type(filter, 'inactive');
    expect(registrations()).toEqual(['ZZ-KFA']);
    await type(filter, 'zz-q');
    expect(page.querySelector('sw-airframes-table')?.textContent).toContain('No airframe matches “zz-q”.');
  });

  it('sorts airframes by a column header, the other way on a second click', async () => {
    await open('pilot');
    await answerLists();
    const header = Array.from(page.querySelectorAll<HTMLElement>('sw-airframes-table th')).find((th) => th.textContent?.includes('Serial'))!;
    header.querySelector<HTMLElement>('.mat-sort-header-container')!.click();
    await fixture.whenStable();
    expect(registrations()).toEqual(['ZZ-KFT', 'ZZ-KFA', 'ZZ-KFB']);
    header.querySelector<HTMLElement>('.mat-sort-header-container')!.click();
    await fixture.whenStable();
    expect(registrations()).toEqual(['ZZ-KFB', 'ZZ-KFA', 'ZZ-KFT']);
  });

  it('pages a long list ten rows at a time', async () => {
    await open('inspector');
    const many = Array.from({ length: 23 }, (_, i) => ({ ...airframes[0], id: 100 + i, registration: `ZZ-A${String(i).padStart(2, '0')}` }));
    backend.expectOne(API_PATHS.aircraftTypes).flush({ aircraftTypes: types });
    backend.expectOne(API_PATHS.airframes).flush({ airframes: many });
    await fixture.whenStable();
    expect(registrations()).toHaveLength(10);
    expect(registrations()[0]).toBe('ZZ-A00');
    (page.querySelector('sw-airframes-table button[aria-label="Next page"]') as HTMLButtonElement).click();
    await fixture.whenStable();
    expect(registrations()[0]).toBe('ZZ-A10');
    expect(page.querySelector('sw-airframes-table .mat-mdc-paginator-range-label')?.textContent?.trim()).toBe('11 – 20 of 23');
  });

  it.each<Role>(['pilot', 'engineer', 'approver', 'inspector'])('offers the %s no add or edit buttons', async (role) => {
    await open(role);
    await answerLists();
    expect(button(page, 'Add airframe')).toBeUndefined();
    expect(page.querySelector('button[aria-label^="Edit"]')).toBeNull();
    expect(page.querySelector('.lead')?.textContent).toContain('as your administrator keeps them');
  });

  it('lets an admin add an airframe: checks the fields, then shows the server’s field sentence under its field', async () => {
    await open('admin');
    await answerLists();
    button(page, 'Add airframe')!.click();
    await fixture.whenStable();
    const dialog = overlay().querySelector('sw-airframe-dialog') as HTMLElement;
    expect(dialog.querySelector('h2')?.textContent).toContain('Add an airframe');

    button(dialog, 'Add airframe')!.click();
    await fixture.whenStable();
    expect(dialog.textContent).toContain('A registration looks like ZZ-KFA');
    expect(dialog.textContent).toContain('Give the serial number.');
    expect(dialog.textContent).toContain('Choose the aircraft type.');

    const [registration, serial] = Array.from(dialog.querySelectorAll<HTMLInputElement>('input[matinput]'));
    await type(registration, 'zz-kfa');
    await type(serial, 'KT-199');
    (dialog.querySelector('mat-select') as HTMLElement).click();
    await fixture.whenStable();
    Array.from(overlay().querySelectorAll<HTMLElement>('mat-option')).find((o) => o.textContent?.includes('ZZP1'))!.click();
    await fixture.whenStable();
    button(dialog, 'Add airframe')!.click();
    await fixture.whenStable();

    const request = backend.expectOne({ method: 'POST', url: API_PATHS.airframes });
    expect(request.request.body).toEqual({ registration: 'ZZ-KFA', serial: 'KT-199', aircraftTypeId: 1, active: true });
    request.flush(
      { error: { code: 'duplicate', message: 'ZZ-KFA is already in your fleet.', fields: { registration: 'ZZ-KFA is already in your fleet.' } } },
      { status: 409, statusText: 'Conflict' },
    );
    await fixture.whenStable();
    const registrationField = registration.closest('mat-form-field') as HTMLElement;
    expect(registrationField.querySelector('mat-error')?.textContent?.trim()).toBe('ZZ-KFA is already in your fleet.');
    expect(dialog.querySelector('[data-testid="dialog-error"]')).toBeNull();

    await type(registration, 'ZZ-KFC');
    expect(registrationField.querySelector('mat-error')).toBeNull();
    button(dialog, 'Add airframe')!.click();
    await fixture.whenStable();
    backend.expectOne({ method: 'POST', url: API_PATHS.airframes }).flush(
      { airframe: { id: 14, registration: 'ZZ-KFC', serial: 'KT-199', aircraftTypeId: 1, active: true, createdAt: stamp, updatedAt: stamp } },
      { status: 201, statusText: 'Created' },
    );
    await fixture.whenStable();
    expect(registrations()).toEqual(['ZZ-KFA', 'ZZ-KFB', 'ZZ-KFC', 'ZZ-KFT']);
  });

  it('sends only the changed fields when an admin edits an aircraft type', async () => {
    await open('admin');
    await answerLists();
    const tabs = Array.from(page.querySelectorAll<HTMLElement>('[role="tab"]'));
    expect(tabs.map((tab) => tab.textContent?.trim())).toEqual(['Airframes (3)', 'Aircraft types (2)']);
    tabs[1].click();
    await fixture.whenStable();
    (page.querySelector('button[aria-label="Edit ZZT2"]') as HTMLButtonElement).click();
    await fixture.whenStable();
    const dialog = overlay().querySelector('sw-aircraft-type-dialog') as HTMLElement;
    const ceiling = dialog.querySelector('input[formcontrolname="ceilingFt"]') as HTMLInputElement;
    expect(ceiling.value).toBe('30000');

    await type(ceiling, '70000');
    button(dialog, 'Save changes')!.click();
    await fixture.whenStable();
    expect(dialog.textContent).toContain('At most 60,000 ft.');

    await type(ceiling, '31000');
    button(dialog, 'Save changes')!.click();
    await fixture.whenStable();
    const request = backend.expectOne({ method: 'PATCH', url: `${API_PATHS.aircraftTypes}/2` });
    expect(request.request.body).toEqual({ ceilingFt: 31000 });
    request.flush({ aircraftType: { ...types[1], ceilingFt: 31000 } });
    await fixture.whenStable();
    const ceilings = Array.from(page.querySelectorAll('sw-aircraft-types-table td.sw-mono.number')).map((td) => td.textContent!.trim());
    expect(ceilings).toEqual(['14,000', '31,000']);
  });

  it('shows the sentence of a failed load and loads again on request', async () => {
    await open('pilot');
    backend.expectOne(API_PATHS.aircraftTypes).flush({ error: { code: 'server_error', message: 'The database is not answering.' } }, { status: 503, statusText: 'x' });
    // The other list's request is cancelled with the failed one.
    expect(backend.expectOne(API_PATHS.airframes).cancelled).toBe(true);
    await fixture.whenStable();
    expect(page.querySelector('[data-testid="fleet-error"]')?.textContent?.trim()).toBe('The database is not answering.');
    button(page, 'Try again')!.click();
    await fixture.whenStable();
    await answerLists();
    expect(registrations()).toHaveLength(3);
  });
});
