import { checkUrl, type CheckPayload } from '@shared/card-check/check-url';
import { fetchPreloadLinks, firstScreenRequests, SESSION_PATH } from './first-screen-requests';

// A check URL as a printed card's QR code carries it (shared/card-check/check-url.ts builds it).
const payload: CheckPayload = { revisionId: 7, inputs: { airframeId: 3, weightKg: 950, configuration: 'takeoff-flap', departure: { elevationFt: 400, qnhHpa: 1016, oatC: 18 }, isaDeviationC: 3, cruise: { iasKt: 110 }, altitudeStepFt: 2000 }, digest: 'a'.repeat(64) };

describe('firstScreenRequests', () => {
  const qrPath = () => {
    const url = new URL(checkUrl('https://cards.example', 'K7M4RTX9X', payload));
    return { path: url.pathname + url.search, code: url.pathname.split('/')[2]! };
  };

  it('asks for the session beside the sign-in page, and for nothing beside other pages', () => {
    expect(firstScreenRequests('/sign-in')).toEqual([SESSION_PATH]);
    expect(firstScreenRequests('/sign-in?returnUrl=%2Fcards')).toEqual([SESSION_PATH]);
    expect(firstScreenRequests('/home')).toEqual([]);
    expect(firstScreenRequests('/cards?x=1')).toEqual([]);
  });

  it('asks for the verdict of a typed code, and for the card’s source too when the address carries its figures', () => {
    const { path, code } = qrPath();
    expect(firstScreenRequests(`/check/${code}`)).toEqual([SESSION_PATH, `/api/verify/${code}`]);
    expect(firstScreenRequests(path)).toEqual([SESSION_PATH, `/api/verify/${code}`, `/api/verify/${code}/source`]);
  });

  it('asks for the same paths as the page: the code in its stored form, whatever form the address gives', () => {
    const { code } = qrPath();
    const printed = `${code.slice(0, 3)}-${code.slice(3, 6)}-${code.slice(6)}`.toLowerCase();
    expect(firstScreenRequests(`/check/${printed}`)).toEqual([SESSION_PATH, `/api/verify/${code}`]);
  });

  it('asks for no verdict when the address names no valid code, and no source for damaged figures', () => {
    expect(firstScreenRequests('/check/NOTACODE')).toEqual([SESSION_PATH]);
    expect(firstScreenRequests('/check/%3E%3B%20rel%3Dx')).toEqual([SESSION_PATH]);
    const { code } = qrPath();
    expect(firstScreenRequests(`/check/${code}?c=damaged`)).toEqual([SESSION_PATH, `/api/verify/${code}`]);
  });

  it('writes preload links for fetches', () => {
    expect(fetchPreloadLinks(['/api/auth/me'])).toEqual(['</api/auth/me>; rel=preload; as=fetch; crossorigin']);
  });
});
