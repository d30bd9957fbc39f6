import type { AircraftCategory } from '@shared/speed-book/revision-content';

/** How the fleet pages name each category of aircraft type. */
export const AIRCRAFT_CATEGORY_LABELS: Readonly<Record<AircraftCategory, string>> = {
  'piston-single': 'Single-engine piston',
  'piston-twin': 'Twin piston',
  turboprop: 'Turboprop',
  jet: 'Jet',
};
