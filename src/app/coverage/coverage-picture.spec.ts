import { ComponentFixture, TestBed } from '@angular/core/testing';
import { coverageReport, coverageSheet, smallCoverageReport } from '@shared/api/testing/coverage-fixtures';
import { CoveragePicture } from './coverage-picture';

describe('CoveragePicture', () => {
  let fixture: ComponentFixture<CoveragePicture>;
  let page: HTMLElement;

  beforeEach(() => {
    TestBed.configureTestingModule({ imports: [CoveragePicture] });
    fixture = TestBed.createComponent(CoveragePicture);
    page = fixture.nativeElement;
  });

  async function draw(report = smallCoverageReport()): Promise<void> {
    fixture.componentRef.setInput('report', report);
    await fixture.whenStable();
  }

  const text = (selector: string, root: ParentNode = page) => (root.querySelector(selector)?.textContent ?? '').replace(/\s+/g, ' ').trim();
  const cellAt = (sheet: number, oatC: number, ft: number, kg: number) => {
    const label = `${kg.toLocaleString('en-GB')} kg, ${ft.toLocaleString('en-GB').replace('-', '\u2212')} ft, ${oatC > 0 ? '+' : ''}${String(oatC).replace('-', '\u2212')} °C`;
    const cells = page.querySelectorAll('[data-testid="coverage-sheet"]')[sheet]?.querySelectorAll<HTMLButtonElement>('button.cell') ?? [];
    const cell = [...cells].find((b) => b.getAttribute('aria-label')?.startsWith(`${label}:`));
    if (!cell) throw new Error(`no cell ${label}`);
    return cell;
  };

  it('draws one grid per temperature band for each sheet, with every cell of the report', async () => {
    await draw();
    const sheets = page.querySelectorAll('[data-testid="coverage-sheet"]');
    expect([...sheets].map((s) => text('h3', s))).toEqual(['Takeoff · Flaps 15', 'Landing · Flaps 40']);
    expect([...sheets[0]!.querySelectorAll('table caption')].map((c) => c.textContent!.replace(/\s+/g, ' ').trim())).toEqual([
      'OAT −20 °C · 1 not issued',
      'OAT +40 °C · 1 not issued',
    ]);
    // 3 weights × 3 altitudes × 2 bands on takeoff, 2 × 2 × 2 on landing: 26 points in the report.
    expect(sheets[0]!.querySelectorAll('button.cell')).toHaveLength(18);
    expect(sheets[1]!.querySelectorAll('button.cell')).toHaveLength(8);
    // Highest altitude at the top, as the axis rises.
    expect([...sheets[0]!.querySelectorAll('table')[0]!.querySelectorAll('tbody th')].map((th) => th.textContent!.trim())).toEqual(['4,000', '2,000', '0']);
  });

  it('marks each outcome with its own symbol and says it in words, never by colour alone', async () => {
    await draw();
    const refused = cellAt(0, 40, 4000, 3400);
    const broken = cellAt(0, -20, 0, 2600);
    const issued = cellAt(0, -20, 0, 3000);
    expect([refused, broken, issued].map((c) => c.dataset['outcome'])).toEqual(['refused', 'rule-broken', 'issued']);
    expect([refused, broken, issued].map((c) => c.textContent!.trim())).toEqual(['✕', '!', '✓']);
    expect(refused.getAttribute('aria-label')).toBe('3,400 kg, 4,000 ft, +40 °C: card refused');
    expect(broken.getAttribute('aria-label')).toBe('2,600 kg, 0 ft, −20 °C: rule broken');
    expect([...page.querySelectorAll('.legend li')].slice(0, 3).map((li) => li.textContent!.trim())).toEqual(['✓card issued', '✕card refused', '!rule broken']);
  });

  it('counts each sheet and the whole sweep', async () => {
    await draw();
    const counts = page.querySelectorAll('[data-testid="coverage-sheet"] [data-testid="sheet-counts"] > span');
    expect([...counts].map((c) => c.textContent!.replace(/\s+/g, ' ').trim())).toEqual([
      ...['✓16 issued', '✕1 refused', '!1 rule broken', 'of 18 points'],
      ...['✓8 issued', '✕0 refused', '!0 rule broken', 'of 8 points'],
    ]);
    expect(text('[data-testid="coverage-verdict"] > span')).toBe(
      'The book does not yet cover its envelope. 26 points swept: 24 give a card, 1 is refused, 1 breaks an ordering rule. 1 broken rule has no recorded exception.',
    );
  });

  it('gives a cell’s reason on keyboard focus, on tap and on hover', async () => {
    await draw();
    const detail = () => text('[data-testid="coverage-sheet"] [data-testid="coverage-detail"]');
    expect(detail()).toBe('Point at, tap or tab to a cell to read what the card does there.');

    cellAt(0, 40, 4000, 3400).focus();
    await fixture.whenStable();
    expect(detail()).toBe('✕3,400 kg, 4,000 ft, +40 °C: card refused. VR: 3,400 kg at 4,000 ft and +40 °C is outside the table (it stops at +30 °C).');

    cellAt(0, -20, 0, 2600).click();
    await fixture.whenStable();
    expect(detail()).toBe('!2,600 kg, 0 ft, −20 °C: rule broken. V2 97 KIAS is below VR 98 KIAS (V1 ≤ VR ≤ V2). Rule: V1 ≤ VR ≤ V2.');

    cellAt(0, -20, 2000, 3000).dispatchEvent(new MouseEvent('mouseenter'));
    await fixture.whenStable();
    expect(detail()).toBe('✓3,000 kg, 2,000 ft, −20 °C: card issued. A card is given at this point.');
    // The pointer leaving gives back the cell last tapped, which stays marked.
    cellAt(0, -20, 2000, 3000).dispatchEvent(new MouseEvent('mouseleave'));
    await fixture.whenStable();
    expect(detail()).toMatch(/^!2,600 kg, 0 ft, −20 °C: rule broken\./);
    expect(cellAt(0, -20, 0, 2600).classList).toContain('pinned');
    expect(page.querySelectorAll('button.cell.pinned')).toHaveLength(1);
  });

  it('keeps one tab stop per grid and moves within it with the arrow keys', async () => {
    await draw();
    const firstBand = page.querySelector('[data-testid="coverage-sheet"] table')!;
    const stops = () => [...firstBand.querySelectorAll<HTMLButtonElement>('button.cell')].filter((b) => b.tabIndex === 0);
    expect(stops()).toHaveLength(1);
    expect(stops()[0]!.getAttribute('aria-label')).toMatch(/^2,600 kg, 4,000 ft/);

    stops()[0]!.focus();
    stops()[0]!.dispatchEvent(new KeyboardEvent('keydown', { key: 'ArrowDown', bubbles: true }));
    await fixture.whenStable();
    expect(document.activeElement?.getAttribute('aria-label')).toMatch(/^2,600 kg, 2,000 ft/);
    (document.activeElement as HTMLElement).dispatchEvent(new KeyboardEvent('keydown', { key: 'End', bubbles: true }));
    await fixture.whenStable();
    expect(document.activeElement?.getAttribute('aria-label')).toMatch(/^3,400 kg, 2,000 ft/);
    expect(stops()).toHaveLength(1);
    expect(stops()[0]).toBe(document.activeElement);
  });

  it('lists the broken rules with source, count, first message and the recorded exception', async () => {
    await draw();
    const rules = page.querySelectorAll('[data-testid="coverage-rules"] li');
    expect(rules).toHaveLength(2);
    expect(text('.rule-title', rules[0])).toBe('V1 ≤ VR ≤ V2');
    expect(text('.rule-source', rules[0])).toBe('Source: CS 25.107 and 14 CFR 25.107 (from memory)');
    expect(text('.rule-count', rules[0])).toBe('broken at 1 point');
    expect(text('.rule-first', rules[0])).toBe('First: At 2,600 kg, 0 ft, −20 °C: V2 97 KIAS is below VR 98 KIAS.');
    expect(text('[data-testid="rule-no-exception"]', rules[0])).toContain('No exception recorded');
    expect(text('[data-testid="rule-exception"] span', rules[1])).toBe(
      'Exception recorded from the flight manual: AFM 4.3: VMC is the air-minimum control speed with the critical engine out; landing flap approach uses VREF + 5.',
    );
  });

  it('shows a rule-broken cell’s recorded exception beside its reason', async () => {
    const report = smallCoverageReport();
    report.rules[0]!.exception = 'AFM 2.1: V2 is stated for the climb gradient, not from VR.';
    report.passes = true;
    report.sheets[0]!.cells.find((c) => c.outcome === 'refused')!.outcome = 'issued';
    await draw(report);
    cellAt(0, -20, 0, 2600).focus();
    await fixture.whenStable();
    expect(text('[data-testid="coverage-detail"]')).toContain('Recorded exception — V1 ≤ VR ≤ V2: AFM 2.1: V2 is stated for the climb gradient, not from VR.');
  });

  it('says plainly when the book covers its whole envelope', async () => {
    const sheet = coverageSheet('takeoff', 'takeoff-flap', 'Flaps 10', { weightsKg: [700, 900], pressureAltitudesFt: [-1000, 0, 5000], oatsC: [-30, 45] });
    await draw(coverageReport([sheet]));
    expect(text('[data-testid="coverage-verdict"] > span')).toContain('The book gives a card everywhere in its envelope. 12 points swept: 12 give a card, 0 are refused, 0 break an ordering rule.');
    expect(page.querySelector('[data-testid="coverage-rules"]')).toBeNull();
    expect(text('[data-testid="coverage-sheet"] .envelope')).toBe('Envelope: 700 kg to 900 kg; −1,000 ft to 5,000 ft; −30 °C to +45 °C');
  });
});
