/**
 * Revision contents and inputs for the card tests and the benchmark, with numbers chosen so the
 * cards can be worked by hand: two-point position-error tables (a straight line), round
 * reference speeds. Invented test data — not for flight.
 */
import { contentSha256 } from '../../speed-book/canonical';
import type { RevisionContent } from '../../speed-book/revision-content';
import type { CardContext, CardInputs, CardRevision } from '../card';

/**
 * A single-engine piston type. Clean: CAS = 37 + 0.9·(IAS − 30) from 30 to 150 KIAS.
 * Flap: CAS = 33 + 0.9·(IAS − 25) from 25 to 95 KIAS. VR tabulated by weight, pressure
 * altitude and OAT; VS1 and VS0 scaled in CAS from 1,000 kg; VY fixed.
 */
export function handPistonContent(): RevisionContent {
  return {
    schemaVersion: 1,
    aircraft: { category: 'piston-single', engines: 1, ceilingFt: 10000 },
    weights: { minimumKg: 600, maximumTakeoffKg: 1000, maximumLandingKg: 950, referenceKg: 1000 },
    configurations: [
      { key: 'clean', label: 'Flaps up', positionError: [{ iasKt: 30, casKt: 37 }, { iasKt: 150, casKt: 145 }] },
      { key: 'flap', label: 'Flaps down', positionError: [{ iasKt: 25, casKt: 33 }, { iasKt: 95, casKt: 96 }] },
    ],
    speeds: [
      { code: 'VS1', label: 'Stall, flaps up', phase: 'any', configurationKey: 'clean', basis: 'cas', kind: 'scaled', referenceKt: 50 },
      { code: 'VS0', label: 'Stall, flaps down', phase: 'landing', configurationKey: 'flap', basis: 'cas', kind: 'scaled', referenceKt: 45 },
      {
        code: 'VR', label: 'Rotate', phase: 'takeoff', configurationKey: 'flap', basis: 'ias', kind: 'tabulated',
        byWeightKg: [800, 1000], byPressureAltitudeFt: [0, 4000], byOatC: [-10, 30],
        valuesKt: [
          [[50, 51], [52, 53]],
          [[56, 57], [58, 59]],
        ],
      },
      { code: 'VY', label: 'Best rate of climb', phase: 'climb', configurationKey: 'clean', basis: 'ias', kind: 'fixed', valueKt: 80 },
    ],
    limits: { vnoKt: 120, vneKt: 135, vfeKt: { flap: 90 } },
    indicatorMarkingBasis: 'ias',
    notes: 'Invented test data — not for flight.',
  };
}

/**
 * A twin-jet whose clean position-error table is the identity (IAS = CAS from 100 to 450 kt),
 * so the altitude table can be checked against published CAS/EAS/TAS values directly.
 */
export function handJetContent(): RevisionContent {
  return {
    schemaVersion: 1,
    aircraft: { category: 'jet', engines: 2, ceilingFt: 40000 },
    weights: { minimumKg: 5000, maximumTakeoffKg: 8000, maximumLandingKg: 7500, referenceKg: 8000 },
    configurations: [
      { key: 'clean', label: 'Flaps up', positionError: [{ iasKt: 100, casKt: 100 }, { iasKt: 450, casKt: 450 }] },
      { key: 'flap', label: 'Flaps 20°', positionError: [{ iasKt: 80, casKt: 84 }, { iasKt: 250, casKt: 250 }] },
    ],
    speeds: [
      { code: 'VS1', label: 'Stall, flaps up', phase: 'any', configurationKey: 'clean', basis: 'cas', kind: 'scaled', referenceKt: 130 },
      { code: 'V2', label: 'Takeoff safety speed', phase: 'takeoff', configurationKey: 'flap', basis: 'cas', kind: 'scaled', referenceKt: 125 },
    ],
    limits: { vmoKt: 300, mmo: 0.8, vfeKt: { flap: 200 }, vmcKt: 105, vyseKt: 140 },
    indicatorMarkingBasis: 'cas',
    notes: 'Invented test data — not for flight.',
  };
}

/** A revision of `content` with its correct hash. */
export function revisionOf(content: RevisionContent, id = 11, number = 3): CardRevision {
  return { id, number, publishedAt: '2026-11-30T08:00:00.000Z', contentSha256: contentSha256(content), content };
}

export const HAND_CONTEXT: CardContext = {
  airframe: { id: 7, registration: 'ZZ-TST' },
  aircraftType: { designator: 'ZZH1', name: 'Hand-worked test type (invented)' },
  speedBook: { id: 5, title: 'Test speed book' },
  demo: true,
};

/** 900 kg, landing 850 kg, flap takeoff at a 2,000 ft field on a standard QNH, OAT 0 °C. */
export function handPistonInputs(): CardInputs {
  return {
    airframeId: 7,
    weightKg: 900,
    landingWeightKg: 850,
    configuration: 'flap',
    departure: { elevationFt: 2000, qnhHpa: 1013.25, oatC: 0 },
    isaDeviationC: 0,
    cruise: { iasKt: 100 },
    altitudeStepFt: 2500,
  };
}

/**
 * The digest of the card of `handPistonInputs()` on `handPistonContent()` (revision 11, number 3,
 * `HAND_CONTEXT`). It changes whenever anything on that card changes: when it does on purpose,
 * update it here (card-digest.spec.ts checks it in Node, test/e2e/card-digest.e2e.ts in
 * Chromium) and raise CARD_VERSION if a field changed its meaning.
 */
export const HAND_PISTON_CARD_DIGEST = '4f215f766a6ca925d9d3092137b30571333d5d84af689e1d4cea04d0f9d116bc';
