import { demoLightTwinJetContent, demoTwinTurbopropContent } from '../speed-book/demo-content';
import { revisionContentSchema, type RevisionContent } from '../speed-book/revision-content';
import { axisPoints, MAX_POINTS_PER_AXIS, MAX_SWEEP_POINTS, sweepEnvelope } from './coverage';

const parsed = (content: RevisionContent) => revisionContentSchema.parse(content);

describe('sweepEnvelope: the envelope proof (issue 11)', () => {
  it('sweeps every takeoff configuration and every landing configuration over the declared envelope', () => {
    const report = sweepEnvelope(parsed(demoLightTwinJetContent()));
    expect(report.sheets.map((sheet) => `${sheet.phase}:${sheet.configurationKey}`)).toEqual(['takeoff:takeoff-flap', 'landing:landing-flap']);
    expect(report.envelope.takeoff).toEqual({ pressureAltitudeFt: [-1000, 10000], oatC: [-40, 50], weightKg: [3100, 4800] });
    expect(report.envelope.landing.weightKg).toEqual([3100, 4400]);
    for (const sheet of report.sheets) {
      const { weightsKg, pressureAltitudesFt, oatsC } = sheet.grid;
      expect(sheet.cells).toHaveLength(weightsKg.length * pressureAltitudesFt.length * oatsC.length);
      // Ordered by OAT, then altitude, then weight, so a picture slices one weight × altitude grid per band.
      expect(sheet.cells[0]).toMatchObject({ oatC: oatsC[0], pressureAltitudeFt: pressureAltitudesFt[0], weightKg: weightsKg[0] });
      expect(sheet.cells[1]).toMatchObject({ oatC: oatsC[0], pressureAltitudeFt: pressureAltitudesFt[0], weightKg: weightsKg[1] });
      // The table breakpoints inside the envelope are grid points (where interpolation bends).
      if (sheet.phase === 'takeoff') expect(pressureAltitudesFt).toEqual(expect.arrayContaining([-1000, 5000, 10000]));
    }
    expect(report.counts.points).toBe(report.counts.issued + report.counts.refused + report.counts.ruleBroken);
  });

  it('finds a gap in a takeoff table: the points beyond it are refused with the table’s reason, and the report fails', () => {
    const content = demoTwinTurbopropContent();
    // VR's table stops at 4,000 ft while the envelope declares 8,000 ft: valid field by field,
    // a hole only the sweep shows.
    for (const speed of content.speeds) {
      if (speed.code === 'VR' && speed.kind === 'tabulated') {
        speed.byPressureAltitudeFt = [-1000, 2000, 4000];
      }
    }
    const report = sweepEnvelope(parsed(content));
    expect(report.passes).toBe(false);
    const takeoff = report.sheets.find((sheet) => sheet.phase === 'takeoff')!;
    const refused = takeoff.cells.filter((cell) => cell.outcome === 'refused');
    expect(refused.length).toBeGreaterThan(0);
    expect(refused.every((cell) => cell.pressureAltitudeFt > 4000)).toBe(true);
    expect(takeoff.cells.filter((cell) => cell.pressureAltitudeFt <= 4000).every((cell) => cell.outcome === 'issued')).toBe(true);
    expect(refused[0].reason).toMatch(/^VR \(Rotate\): A pressure altitude of .* ft is outside the flight manual's table/);
    expect(report.sheets.find((sheet) => sheet.phase === 'landing')!.cells.every((cell) => cell.outcome === 'issued')).toBe(true);
  });

  it('reports a broken rule once per rule, with its title, source, count and the first point', () => {
    const content = demoTwinTurbopropContent();
    content.limits.vmcKt = 100; // 1.1 × VMC is then above V2 at light weights
    const report = sweepEnvelope(parsed(content));
    const finding = report.rules.find((rule) => rule.ruleId === 'v2-vmc')!;
    expect(finding).toMatchObject({ title: 'V2 ≥ 1.1 × VMC', source: expect.stringMatching(/25\.107/) });
    expect(finding.brokenAt).toBeGreaterThan(0);
    expect(finding.firstMessage).toMatch(/^At 3,600 kg, −1,000 ft, −40 °C \(takeoff, Flaps approach\): V2 /);
    expect(report.passes).toBe(false);
  });

  it('sweeps a legacy book (no declared envelope) over the envelope derived from its tables', () => {
    const content = demoLightTwinJetContent();
    delete content.envelope;
    const report = sweepEnvelope(parsed(content));
    expect(report.envelope.takeoff.pressureAltitudeFt).toEqual([-1000, 10000]);
    expect(report.envelope.takeoff.oatC).toEqual([-40, 50]);
    expect(report.envelope.landing.pressureAltitudeFt).toEqual([-2000, 41000]);
  });

  it('bounds the grid whatever the steps asked (every loop an input can grow is bounded)', () => {
    const report = sweepEnvelope(parsed(demoLightTwinJetContent()), { stepWeightKg: 0.001, stepAltitudeFt: 0.001, stepOatC: 0.001 });
    for (const sheet of report.sheets) {
      expect(sheet.grid.weightsKg.length).toBeLessThanOrEqual(MAX_POINTS_PER_AXIS.weightKg);
      expect(sheet.grid.pressureAltitudesFt.length).toBeLessThanOrEqual(MAX_POINTS_PER_AXIS.altitudeFt);
      expect(sheet.grid.oatsC.length).toBeLessThanOrEqual(MAX_POINTS_PER_AXIS.oatC);
    }
  });
});

describe('axisPoints', () => {
  it('keeps the ends and the breakpoints inside, fills at most `step` apart, rising', () => {
    expect(axisPoints([0, 10], [5, 20], 5, 10)).toEqual([0, 5, 10]);
    expect(axisPoints([0, 10], [], 2.5, 10)).toEqual([0, 2.5, 5, 7.5, 10]);
    expect(axisPoints([-1000, 8000], [4000], 1000, 13)).toEqual([-1000, 0, 1000, 2000, 3000, 4000, 5000, 6000, 7000, 8000]);
  });
});

describe('the sweep’s bound', () => {
  it('keeps a book with twelve takeoff configurations within MAX_SWEEP_POINTS', () => {
    const content = demoLightTwinJetContent();
    const template = content.configurations[1];
    const v1 = content.speeds.filter((speed) => speed.phase === 'takeoff');
    for (let i = 0; i < 9; i++) {
      content.configurations.push({ ...template, key: `takeoff-${i}`, label: `Takeoff ${i}` });
      content.speeds.push(...v1.map((speed) => ({ ...speed, configurationKey: `takeoff-${i}` })));
    }
    const report = sweepEnvelope(parsed(content));
    expect(report.sheets).toHaveLength(11);
    expect(report.counts.points).toBeLessThanOrEqual(MAX_SWEEP_POINTS * 1.05);
  });

  it('thins many breakpoints to an even choice', () => {
    const breakpoints = Array.from({ length: 200 }, (_, i) => i * 5 + 1);
    expect(axisPoints([0, 1000], breakpoints, 1000, 9).length).toBeLessThanOrEqual(9);
  });
});
