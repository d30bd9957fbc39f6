import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { Legend, LineElement, LinearScale, PointElement, ScatterController, Tooltip, type ChartConfiguration } from 'chart.js';
import { BaseChartDirective, provideCharts } from 'ng2-charts';
import type { SpeedCard } from '@shared/card';
import { ThemePreference } from '../core/theme/theme-preference';
import { altitudeSeries, type AltitudePoint } from './altitude-series';

type ScatterConfig = ChartConfiguration<'scatter', AltitudePoint[]>;

interface Palette {
  readonly cruise: string;
  readonly limit: string;
  readonly crossover: string;
  readonly ink: string;
  readonly grid: string;
}

const DAY: Palette = { cruise: '#1f6f84', limit: '#c62828', crossover: '#8a6100', ink: '#1b2326', grid: 'rgba(27,35,38,0.14)' };
const NIGHT: Palette = { cruise: '#6cc0d4', limit: '#e0665c', crossover: '#d0a43a', ink: '#b9c2c6', grid: 'rgba(185,194,198,0.16)' };

/**
 * TAS and Mach of the planned cruise against pressure altitude, beside the speed limit that
 * governs at each altitude (VMO below the crossover, MMO above it; VNE for pistons). Two panels
 * share the altitude axis; the limit is dashed so it does not rely on colour alone.
 */
@Component({
  selector: 'sw-altitude-chart',
  imports: [BaseChartDirective],
  // Only the chart.js pieces drawn here, registered by this lazy component.
  providers: [provideCharts({ registerables: [ScatterController, LineElement, PointElement, LinearScale, Legend, Tooltip] })],
  template: `
    <div class="panels">
      <div class="panel">
        <canvas baseChart type="scatter" [data]="tasData()" [options]="tasOptions()" role="img" [attr.aria-label]="tasSummary()"></canvas>
      </div>
      <div class="panel">
        <canvas baseChart type="scatter" [data]="machData()" [options]="machOptions()" role="img" [attr.aria-label]="machSummary()"></canvas>
      </div>
    </div>
    <p class="note">{{ note() }}</p>
  `,
  styles: `
    :host {
      display: block;
    }
    .panels {
      display: grid;
      grid-template-columns: repeat(auto-fit, minmax(16rem, 1fr));
      gap: 16px;
    }
    .panel {
      position: relative;
      height: 300px;
    }
    .note {
      margin: 8px 0 0;
      font: var(--mat-sys-body-medium);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AltitudeChart {
  private readonly theme = inject(ThemePreference);

  readonly card = input.required<SpeedCard>();

  private readonly series = computed(() => altitudeSeries(this.card()));
  private readonly palette = computed(() => (this.theme.isNight() ? NIGHT : DAY));

  protected readonly tasData = computed(() => this.data(this.series().cruiseTasKt, this.series().limitTasKt, 'TAS'));
  protected readonly machData = computed(() => this.data(this.series().cruiseMach, this.series().limitMach, 'Mach'));
  protected readonly tasOptions = computed(() => this.options('TAS (kt)', 0));
  protected readonly machOptions = computed(() => this.options('Mach', 2));

  protected readonly tasSummary = computed(() => this.summary('TAS in knots', this.series().cruiseTasKt, this.series().limitTasKt, 0));
  protected readonly machSummary = computed(() => this.summary('Mach', this.series().cruiseMach, this.series().limitMach, 3));
  protected readonly note = computed(() => {
    const { crossoverAltitudeFt, limitName } = this.series();
    const crossover = crossoverAltitudeFt === null ? '' : ` VMO and MMO meet at ${crossoverAltitudeFt.toLocaleString('en-GB')} ft (crossover); MMO limits above it.`;
    return `Pressure altitude up, planned cruise solid, ${limitName ?? 'speed'} limit dashed, on the day's ISA deviation.${crossover}`;
  });

  private data(cruise: AltitudePoint[], limit: AltitudePoint[], what: string): ScatterConfig['data'] {
    const palette = this.palette();
    const datasets: ScatterConfig['data']['datasets'] = [
      { label: `Planned cruise ${what}`, data: cruise, showLine: true, borderColor: palette.cruise, backgroundColor: palette.cruise, borderWidth: 2.5, pointRadius: 2.5 },
    ];
    if (limit.length) {
      datasets.push({
        label: `${this.series().limitName} limit ${what}`,
        data: limit,
        showLine: true,
        borderColor: palette.limit,
        backgroundColor: palette.limit,
        borderDash: [7, 4],
        borderWidth: 2.5,
        pointRadius: 0,
      });
    }
    const crossoverFt = this.series().crossoverAltitudeFt;
    if (crossoverFt !== null) {
      const xs = [...cruise, ...limit].map((point) => point.x);
      datasets.push({
        label: 'Crossover altitude',
        data: [{ x: Math.min(...xs), y: crossoverFt }, { x: Math.max(...xs), y: crossoverFt }],
        showLine: true,
        borderColor: palette.crossover,
        backgroundColor: palette.crossover,
        borderDash: [2, 3],
        borderWidth: 1.5,
        pointRadius: 0,
      });
    }
    return { datasets };
  }

  private options(xTitle: string, decimals: number): ScatterConfig['options'] {
    const palette = this.palette();
    const font = { family: "'Roboto Mono', ui-monospace, monospace", size: 12 };
    return {
      responsive: true,
      maintainAspectRatio: false,
      animation: false,
      scales: {
        x: {
          type: 'linear',
          title: { display: true, text: xTitle, color: palette.ink, font: { size: 13 } },
          ticks: { color: palette.ink, font, callback: (value) => Number(value).toFixed(decimals) },
          grid: { color: palette.grid },
        },
        y: {
          type: 'linear',
          min: 0,
          title: { display: true, text: 'Pressure altitude (ft)', color: palette.ink, font: { size: 13 } },
          ticks: { color: palette.ink, font },
          grid: { color: palette.grid },
        },
      },
      plugins: {
        legend: { position: 'bottom', labels: { color: palette.ink, usePointStyle: false, boxHeight: 2, font: { size: 12 } } },
        tooltip: { callbacks: { label: (item) => `${item.dataset.label}: ${Number(item.parsed.x).toFixed(decimals)} at ${item.parsed.y} ft` } },
      },
    };
  }

  private summary(what: string, cruise: AltitudePoint[], limit: AltitudePoint[], decimals: number): string {
    if (!cruise.length) return `Chart of ${what} against altitude: no rows.`;
    const first = cruise[0];
    const last = cruise[cruise.length - 1];
    const limitWords = limit.length ? `; the limit runs from ${limit[0].x.toFixed(decimals)} to ${limit[limit.length - 1].x.toFixed(decimals)}` : '';
    return `Chart of planned cruise ${what} against pressure altitude: ${first.x.toFixed(decimals)} at ${first.y} ft to ${last.x.toFixed(decimals)} at ${last.y} ft${limitWords}. The altitude table gives every figure.`;
  }
}
