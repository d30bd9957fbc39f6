import { ComponentFixture, TestBed } from '@angular/core/testing';
import type { CardIndicator } from '@shared/card';
import { AirspeedIndicator } from './airspeed-indicator';
import { angleOfKt, dialScale, polar } from '@shared/card/indicator-geometry';

// A piston single's markings (14 CFR 23.1545, from memory): white VS0–VFE, green VS1–VNO,
// yellow VNO–VNE, red line at VNE.
const PISTON: CardIndicator = {
  basis: 'ias',
  arcs: [
    { colour: 'white', fromKt: 45, toKt: 85 },
    { colour: 'green', fromKt: 50, toKt: 125 },
    { colour: 'yellow', fromKt: 125, toKt: 160 },
  ],
  lines: [{ colour: 'red', code: 'VNE', kt: 160 }],
};

describe('airspeed indicator', () => {
  let fixture: ComponentFixture<AirspeedIndicator>;

  async function draw(indicator: CardIndicator): Promise<HTMLElement> {
    fixture = TestBed.createComponent(AirspeedIndicator);
    fixture.componentRef.setInput('indicator', indicator);
    fixture.componentRef.setInput('caption', 'at 1,000 kg');
    await fixture.whenStable();
    return fixture.nativeElement;
  }

  it('scales 0 kt to a round figure above the highest marking over a 300° sweep', () => {
    // Highest 160 kt, +10 % = 176, rounded up to the 20 kt numbering: 180 kt.
    expect(dialScale(PISTON)).toEqual({ minKt: 0, maxKt: 180, majorStepKt: 20, minorStepKt: 5 });
    const scale = dialScale(PISTON);
    expect(angleOfKt(0, scale)).toBe(-150);
    expect(angleOfKt(90, scale)).toBe(0); // half the scale is straight up
    expect(angleOfKt(180, scale)).toBe(150);
    expect(angleOfKt(400, scale)).toBe(150); // beyond the scale: pinned at its end
  });

  it('draws each arc between the angles of its two speeds', async () => {
    const page = await draw(PISTON);
    // angle = −150° + kt / 180 kt × 300° (worked by hand): 45 → −75, 85 → −8.33, 50 → −66.67, 125 → 58.33, 160 → 116.67.
    const arcs = Array.from(page.querySelectorAll<SVGPathElement>('path[data-colour]')).filter((path) => !path.closest('.swatch'));
    const angles = arcs.map((arc) => [arc.dataset['colour'], Number(arc.dataset['fromDeg']), Number(arc.dataset['toDeg'])]);
    expect(angles).toEqual([
      ['white', -75, expect.closeTo(-8.333, 2)],
      ['green', expect.closeTo(-66.667, 2), expect.closeTo(58.333, 2)],
      ['yellow', expect.closeTo(58.333, 2), expect.closeTo(116.667, 2)],
    ]);
    // The green arc's path starts and ends on its circle at those angles.
    const green = arcs[1].getAttribute('d')!;
    const start = polar(120, 120, 95, -66.6667);
    expect(green.startsWith(`M ${start.x} ${start.y}`)).toBe(true);
  });

  it('draws the red line across the scale at VNE and says every marking in words', async () => {
    const page = await draw(PISTON);
    const line = page.querySelector<SVGLineElement>('line[data-code="VNE"]')!;
    expect(Number(line.dataset['deg'])).toBeCloseTo(116.667, 2);
    const legend = Array.from(page.querySelectorAll('[data-testid="indicator-legend"] li')).map((li) => li.textContent!.replace(/\s+/g, ' ').trim());
    expect(legend).toEqual([
      'White arc — flap operating range, VS0 to VFE: 45–85 kt',
      'Green arc — normal operating range, VS1 to VNO: 50–125 kt',
      'Yellow arc — caution range, VNO to VNE: smooth air only: 125–160 kt',
      'Red line — VNE, never exceed: 160 kt',
    ]);
    expect(page.querySelector('svg.dial')!.getAttribute('aria-label')).toContain('Green arc — normal operating range, VS1 to VNO, 50–125 kt');
    expect(page.textContent).toContain('KIAS');
  });

  it("shows a jet's VMO line and a twin's VMC and VYSE lines in their colours", async () => {
    const page = await draw({
      basis: 'cas',
      arcs: [{ colour: 'white', fromKt: 95, toKt: 200 }],
      lines: [
        { colour: 'red', code: 'VMO', kt: 300 },
        { colour: 'red', code: 'VMC', kt: 105 },
        { colour: 'blue', code: 'VYSE', kt: 140 },
      ],
    });
    // 300 kt +10 % = 330, numbered every 40 kt above 180: 360 kt full scale.
    expect(Number(page.querySelector<SVGLineElement>('line[data-code="VMO"]')!.dataset['deg'])).toBeCloseTo(-150 + (300 / 360) * 300, 6);
    expect(page.querySelector('line[data-code="VYSE"]')!.getAttribute('class')).toContain('radial-blue');
    expect(page.textContent).toContain('KCAS');
  });
});
