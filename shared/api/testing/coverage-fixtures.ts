import type { CoverageCell, CoverageReport, CoverageSheet } from '../../card/coverage-report';

/**
 * Hand-built coverage reports for tests and screenshots (invented, not the output of a sweep):
 * the client's tests draw them without a server, and the schema's tests parse them.
 */

type CellRule = (point: { weightKg: number; pressureAltitudeFt: number; oatC: number }) => Omit<CoverageCell, 'weightKg' | 'pressureAltitudeFt' | 'oatC'>;

const issued: CellRule = () => ({ outcome: 'issued' });

/** A sheet whose cells are ordered as the contract says: OAT, then altitude, then weight. */
export function coverageSheet(
  phase: CoverageSheet['phase'],
  configurationKey: string,
  configurationLabel: string,
  grid: CoverageSheet['grid'],
  rule: CellRule = issued,
): CoverageSheet {
  const cells: CoverageCell[] = [];
  for (const oatC of grid.oatsC)
    for (const pressureAltitudeFt of grid.pressureAltitudesFt)
      for (const weightKg of grid.weightsKg) cells.push({ weightKg, pressureAltitudeFt, oatC, ...rule({ weightKg, pressureAltitudeFt, oatC }) });
  return { phase, configurationKey, configurationLabel, grid, cells };
}

/** Counts and `passes` as the sweep would give them for these sheets and rules. */
export function coverageReport(sheets: CoverageSheet[], rules: CoverageReport['rules'] = []): CoverageReport {
  const cells = sheets.flatMap((s) => s.cells);
  const range = (values: number[]): [number, number] => [Math.min(...values), Math.max(...values)];
  const envelopeOf = (phase: CoverageSheet['phase']) => {
    const mine = sheets.filter((s) => s.phase === phase);
    const grid = mine[0]?.grid ?? { weightsKg: [0, 1], pressureAltitudesFt: [0, 1], oatsC: [0, 1] };
    return { pressureAltitudeFt: range(grid.pressureAltitudesFt), oatC: range(grid.oatsC), weightKg: range(grid.weightsKg) };
  };
  const refused = cells.filter((c) => c.outcome === 'refused').length;
  const ruleBroken = cells.filter((c) => c.outcome === 'rule-broken').length;
  return {
    envelope: { takeoff: envelopeOf('takeoff'), landing: envelopeOf('landing') },
    sheets,
    rules,
    counts: { points: cells.length, issued: cells.length - refused - ruleBroken, refused, ruleBroken },
    passes: refused === 0 && rules.every((r) => r.exception !== undefined),
  };
}

/**
 * A small report with every outcome: takeoff at 2,600–3,400 kg, 0–4,000 ft, two bands; the
 * 3,400 kg column at 4,000 ft and +40 °C is refused (a gap in the VR table), and V2 falls below VR
 * at 2,600 kg, 0 ft, −20 °C (no exception recorded). Landing is all issued; one landing rule
 * is broken nowhere in the grid but carries a recorded exception.
 */
export function smallCoverageReport(): CoverageReport {
  const takeoff = coverageSheet(
    'takeoff',
    'takeoff-flap',
    'Flaps 15',
    { weightsKg: [2600, 3000, 3400], pressureAltitudesFt: [0, 2000, 4000], oatsC: [-20, 40] },
    ({ weightKg, pressureAltitudeFt, oatC }) => {
      if (weightKg === 3400 && pressureAltitudeFt === 4000 && oatC === 40)
        return { outcome: 'refused', reason: 'VR: 3,400 kg at 4,000 ft and +40 °C is outside the table (it stops at +30 °C).' };
      if (weightKg === 2600 && pressureAltitudeFt === 0 && oatC === -20)
        return { outcome: 'rule-broken', reason: 'V2 97 KIAS is below VR 98 KIAS (V1 ≤ VR ≤ V2).', ruleIds: ['v1-vr-v2'] };
      return { outcome: 'issued' };
    },
  );
  const landing = coverageSheet('landing', 'landing-flap', 'Flaps 40', { weightsKg: [2600, 3000], pressureAltitudesFt: [0, 4000], oatsC: [-20, 40] });
  return coverageReport(
    [takeoff, landing],
    [
      {
        ruleId: 'v1-vr-v2',
        title: 'V1 ≤ VR ≤ V2',
        source: 'CS 25.107 and 14 CFR 25.107 (from memory)',
        brokenAt: 1,
        firstMessage: 'At 2,600 kg, 0 ft, −20 °C: V2 97 KIAS is below VR 98 KIAS.',
      },
      {
        ruleId: 'vref-vmc',
        title: 'VREF ≥ VMC',
        source: 'CS 25.125 and 14 CFR 25.125 (from memory)',
        brokenAt: 0,
        firstMessage: 'At 2,600 kg, 0 ft, +40 °C: VREF 92 KIAS is below VMC 93 KIAS.',
        exception: 'AFM 4.3: VMC is the air-minimum control speed with the critical engine out; landing flap approach uses VREF + 5.',
      },
    ],
  );
}

/**
 * A report the size of the demo jet's sweep (three sheets of 9 weights × 12 altitudes × 5
 * bands), with a gap at high, hot and heavy and one broken rule at light weights, for
 * screenshots and for checking the picture stays readable at that size.
 */
export function jetSizedCoverageReport(): CoverageReport {
  const weightsKg = [3200, 3400, 3600, 3800, 4000, 4200, 4400, 4600, 4800];
  const pressureAltitudesFt = [-1000, 0, 1000, 2000, 3000, 4000, 5000, 6000, 7000, 8000, 9000, 10000];
  const oatsC = [-40, -15, 10, 30, 50];
  const takeoffRule: CellRule = ({ weightKg, pressureAltitudeFt, oatC }) => {
    if (oatC === 50 && pressureAltitudeFt >= 6000 && weightKg >= 4200)
      return { outcome: 'refused', reason: `VR: ${weightKg.toLocaleString('en-GB')} kg at ${pressureAltitudeFt.toLocaleString('en-GB')} ft and +50 °C is outside the table (it stops at 5,000 ft above +40 °C).` };
    if (weightKg <= 3400 && oatC <= -15)
      return { outcome: 'rule-broken', reason: 'V2 is below 1.1 × VMC at this weight (V2 ≥ 1.1 × VMC).', ruleIds: ['v2-vmc'] };
    return { outcome: 'issued' };
  };
  const sheets = [
    coverageSheet('takeoff', 'takeoff-flap', 'Flaps 15', { weightsKg, pressureAltitudesFt, oatsC }, takeoffRule),
    coverageSheet('takeoff', 'takeoff-flap-short', 'Flaps 25', { weightsKg, pressureAltitudesFt, oatsC }),
    coverageSheet('landing', 'landing-flap', 'Flaps 35', { weightsKg: weightsKg.slice(0, 7), pressureAltitudesFt, oatsC }),
  ];
  const broken = sheets[0]!.cells.filter((c) => c.outcome === 'rule-broken').length;
  return coverageReport(sheets, [
    {
      ruleId: 'v2-vmc',
      title: 'V2 ≥ 1.1 × VMC',
      source: 'CS 25.107(b) and 14 CFR 25.107(b) (from memory)',
      brokenAt: broken,
      firstMessage: 'At 3,200 kg, −1,000 ft, −40 °C: V2 99 KIAS is below 1.1 × VMC = 101 KIAS.',
    },
  ]);
}
