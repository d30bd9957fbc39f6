import { ComponentFixture, TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { encodeCheckPayload } from '@shared/card-check/check-url';
import { cardCodeCheckCharacter } from '@shared/card-check/card-code';
import { buildCard } from '@shared/card/build-card';
import { HAND_CONTEXT, handPistonContent, handPistonInputs, revisionOf } from '@shared/card/testing/test-fixtures';
import { cameraProblem } from './qr-camera';
import { ScanPage } from './scan-page';

const body = 'K7M4RTX9';
const code = body + cardCodeCheckCharacter(body);

/** A camera whose stream never ends by itself; its tracks record `stop()`. */
function fakeCamera(answer: 'grant' | 'refuse' | 'hold') {
  const tracks = [{ stop: jest.fn(), readyState: 'live' }];
  let release!: () => void;
  const stream = { getTracks: () => tracks };
  const getUserMedia = jest.fn(
    () =>
      new Promise((resolve, reject) => {
        if (answer === 'grant') resolve(stream);
        else if (answer === 'refuse') reject(Object.assign(new Error('denied'), { name: 'NotAllowedError' }));
        else release = () => resolve(stream);
      }),
  );
  Object.defineProperty(navigator, 'mediaDevices', { value: { getUserMedia }, configurable: true });
  return { tracks, getUserMedia, release: () => release() };
}

describe('ScanPage', () => {
  let fixture: ComponentFixture<ScanPage>;
  let page: HTMLElement;
  let navigate: jest.SpyInstance;

  async function open(): Promise<void> {
    TestBed.configureTestingModule({ imports: [ScanPage], providers: [provideRouter([])] });
    navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    fixture = TestBed.createComponent(ScanPage);
    page = fixture.nativeElement;
    fixture.detectChanges();
    for (let i = 0; i < 5; i++) await new Promise((done) => setTimeout(done, 0));
    await fixture.whenStable();
  }

  afterEach(() => {
    Object.defineProperty(navigator, 'mediaDevices', { value: undefined, configurable: true });
  });

  const text = (testId: string) => page.querySelector(`[data-testid="${testId}"]`)?.textContent?.replace(/\s+/g, ' ').trim() ?? null;

  async function type(value: string): Promise<void> {
    const input = page.querySelector<HTMLInputElement>('[data-testid="scan-typed-code"]')!;
    input.value = value;
    input.dispatchEvent(new Event('input'));
    page.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
    await fixture.whenStable();
  }

  it('opens the check page of a typed code, in any case and grouping', async () => {
    fakeCamera('refuse');
    await open();
    await type(' k7m-4rt ' + code.slice(6).toLowerCase());
    expect(navigate).toHaveBeenCalledWith(['/check', code], {});
  });

  it('takes a pasted check address with its figures', async () => {
    fakeCamera('refuse');
    await open();
    const revision = revisionOf(handPistonContent());
    const card = buildCard(revision, handPistonInputs(), HAND_CONTEXT);
    const c = encodeCheckPayload({ revisionId: revision.id, inputs: card.inputs, digest: card.digest });
    await type(`${location.origin}/check/${code}?c=${c}`);
    expect(navigate).toHaveBeenCalledWith(['/check', code], { queryParams: { c } });
  });

  it('names what is wrong with a typed code', async () => {
    fakeCamera('refuse');
    await open();
    await type('K7M-4RT-X9O');
    expect(text('scan-typed-problem')).toContain('never contains the letter O');
    expect(navigate).not.toHaveBeenCalled();
  });

  it('says so when the camera is refused, or when the browser has none', async () => {
    fakeCamera('refuse');
    await open();
    expect(text('scan-camera-problem')).toContain('Camera access was refused');
    expect(page.querySelector('[data-testid="scan-start"]')?.textContent).toContain('Try the camera again');

    TestBed.resetTestingModule();
    Object.defineProperty(navigator, 'mediaDevices', { value: undefined, configurable: true });
    await open();
    expect(text('scan-camera-problem')).toContain('needs a secure (https) address');
  });

  it('releases the camera when the page is left, even while the browser still asks for it', async () => {
    const camera = fakeCamera('hold');
    await open();
    expect(camera.getUserMedia).toHaveBeenCalledTimes(1);
    fixture.destroy();
    camera.release();
    await new Promise((done) => setTimeout(done, 0));
    expect(camera.tracks[0].stop).toHaveBeenCalled();
  });

  it('words each camera failure', () => {
    expect(cameraProblem({ name: 'NotFoundError' })).toContain('no camera');
    expect(cameraProblem({ name: 'NotReadableError' })).toContain('busy');
    expect(cameraProblem(new Error('x'))).toContain('could not be started');
  });
});
