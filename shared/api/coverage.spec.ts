import { coverageSheet, jetSizedCoverageReport, smallCoverageReport } from './testing/coverage-fixtures';
import { coverageFailedSchema, coverageReportSchema, coverageResponseSchema } from './coverage';

describe('coverageReportSchema', () => {
  it('reads a report with every outcome, rule findings and a recorded exception', () => {
    const report = smallCoverageReport();
    const parsed = coverageReportSchema.parse(report);
    expect(parsed).toEqual(report);
    expect(parsed.counts).toEqual({ points: 26, issued: 24, refused: 1, ruleBroken: 1 });
    expect(parsed.passes).toBe(false);
  });

  it('reads a report the size of the demo jet’s sweep', () => {
    expect(coverageResponseSchema.safeParse({ report: jetSizedCoverageReport() }).success).toBe(true);
  });

  it('refuses a report with a figure that is not finite', () => {
    const report = smallCoverageReport();
    report.sheets[0]!.cells[0]!.weightKg = Number.NaN;
    expect(coverageReportSchema.safeParse(report).success).toBe(false);
    const infinite = smallCoverageReport();
    (infinite.envelope.takeoff.oatC as [number, number])[1] = Number.POSITIVE_INFINITY;
    expect(coverageReportSchema.safeParse(infinite).success).toBe(false);
  });

  it('refuses a sheet whose cells do not fill its grid', () => {
    const report = smallCoverageReport();
    report.sheets[1]!.cells.pop();
    const result = coverageReportSchema.safeParse(report);
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]?.path).toEqual(['sheets', 1, 'cells']);
  });

  it('refuses an outcome outside the contract', () => {
    const report = smallCoverageReport();
    (report.sheets[0]!.cells[0] as { outcome: string }).outcome = 'maybe';
    expect(coverageReportSchema.safeParse(report).success).toBe(false);
  });

  it('refuses an axis longer than a picture can draw', () => {
    const values = Array.from({ length: 201 }, (_, i) => i * 10);
    const sheet = coverageSheet('takeoff', 'k', 'K', { weightsKg: values, pressureAltitudesFt: [0], oatsC: [15] });
    expect(coverageReportSchema.safeParse({ ...smallCoverageReport(), sheets: [sheet] }).success).toBe(false);
  });
});

describe('coverageFailedSchema (the 422 of submit)', () => {
  const report = smallCoverageReport();

  it('reads the server’s answer: the error middleware’s error with the report inside it', () => {
    const parsed = coverageFailedSchema.parse({ error: { code: 'coverage_failed', message: 'The book leaves 1 point refused.', report } });
    expect(parsed).toEqual({ code: 'coverage_failed', message: 'The book leaves 1 point refused.', report });
    expect(parsed.report.counts.refused).toBe(1);
  });

  it('does not take another refusal for a coverage failure', () => {
    expect(coverageFailedSchema.safeParse({ error: { code: 'validation_failed', message: 'No.' } }).success).toBe(false);
    expect(coverageFailedSchema.safeParse({ error: { code: 'coverage_failed', message: 'No report.' } }).success).toBe(false);
    expect(coverageFailedSchema.safeParse({ error: 'coverage_failed', message: 'A bare code.', report }).success).toBe(false);
  });
});
