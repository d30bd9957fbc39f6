/**
 * Revision content of the demo operator's three types. Invented demo data — not for flight:
 * every figure is made up to be plausible and self-consistent (it passes the revision schema),
 * and none comes from a flight manual. The seed and the tests use these.
 *
 * Each book declares its envelope (pressure altitude from −1,000 ft, temperatures wider than
 * −35…+45 °C), its tables and position-error tables cover it at every weight from the minimum
 * weight up, and its speeds obey every ordering rule there (shared/card/ordering-rules.ts) —
 * the envelope sweep proves it in shared/card/demo-books.spec.ts.
 */
import type { RevisionContent } from './revision-content';

export const DEMO_NOTES = 'Invented demo data — not for flight.';

/** A four-seat single-engine piston trainer, first revision. */
export function demoPistonTrainerContent(): RevisionContent {
  return {
    schemaVersion: 1,
    aircraft: { category: 'piston-single', engines: 1, ceilingFt: 14000 },
    weights: { minimumKg: 700, maximumTakeoffKg: 1100, maximumLandingKg: 1100, referenceKg: 1100 },
    configurations: [
      {
        key: 'clean',
        label: 'Flaps up',
        positionError: [
          { iasKt: 30, casKt: 40 },
          { iasKt: 60, casKt: 63 },
          { iasKt: 80, casKt: 81 },
          { iasKt: 100, casKt: 100 },
          { iasKt: 120, casKt: 119 },
          { iasKt: 140, casKt: 138 },
          { iasKt: 160, casKt: 157 },
        ],
      },
      {
        key: 'takeoff-flap',
        label: 'Flaps 10°',
        positionError: [
          { iasKt: 30, casKt: 39 },
          { iasKt: 50, casKt: 55 },
          { iasKt: 60, casKt: 63 },
          { iasKt: 80, casKt: 80 },
          { iasKt: 100, casKt: 99 },
          { iasKt: 110, casKt: 108 },
        ],
      },
      {
        key: 'landing-flap',
        label: 'Flaps 30°',
        positionError: [
          { iasKt: 25, casKt: 36 },
          { iasKt: 45, casKt: 50 },
          { iasKt: 55, casKt: 58 },
          { iasKt: 70, casKt: 70 },
          { iasKt: 85, casKt: 84 },
          { iasKt: 95, casKt: 93 },
        ],
      },
    ],
    speeds: [
      { code: 'VS1', label: 'Stall, flaps up', phase: 'any', configurationKey: 'clean', basis: 'ias', kind: 'scaled', referenceKt: 50 },
      { code: 'VS0', label: 'Stall, landing flap', phase: 'landing', configurationKey: 'landing-flap', basis: 'ias', kind: 'scaled', referenceKt: 44 },
      { code: 'VR', label: 'Rotate', phase: 'takeoff', configurationKey: 'takeoff-flap', basis: 'ias', kind: 'scaled', referenceKt: 55 },
      { code: 'VX', label: 'Best angle of climb', phase: 'climb', configurationKey: 'clean', basis: 'ias', kind: 'scaled', referenceKt: 62 },
      { code: 'VY', label: 'Best rate of climb', phase: 'climb', configurationKey: 'clean', basis: 'ias', kind: 'scaled', referenceKt: 76 },
      { code: 'VA', label: 'Manoeuvring speed', phase: 'any', configurationKey: 'clean', basis: 'ias', kind: 'scaled', referenceKt: 105 },
      { code: 'VBG', label: 'Best glide', phase: 'any', configurationKey: 'clean', basis: 'ias', kind: 'scaled', referenceKt: 70 },
      { code: 'VREF', label: 'Final approach, flaps 30°', phase: 'landing', configurationKey: 'landing-flap', basis: 'ias', kind: 'scaled', referenceKt: 63 },
    ],
    limits: { vnoKt: 125, vneKt: 160, vfeKt: { 'takeoff-flap': 110, 'landing-flap': 85 }, demonstratedCrosswindKt: 15, maximumTailwindKt: 10 },
    indicatorMarkingBasis: 'ias',
    envelope: {
      takeoff: { pressureAltitudeFt: { min: -1500, max: 10000 }, oatC: { min: -40, max: 50 } },
      landing: { pressureAltitudeFt: { min: -1500, max: 10000 }, oatC: { min: -40, max: 50 } },
    },
    notes: DEMO_NOTES,
  };
}

/** The trainer's second revision: a few figures changed so the diff has something to show. */
export function demoPistonTrainerContentRevised(): RevisionContent {
  const content = demoPistonTrainerContent();
  content.configurations[2].positionError[1] = { iasKt: 45, casKt: 51 };
  for (const speed of content.speeds) {
    if (speed.code === 'VR' && speed.kind === 'scaled') speed.referenceKt = 56;
    if (speed.code === 'VX' && speed.kind === 'scaled') speed.referenceKt = 63;
    // With the corrected flaps-30° calibration VS0 reads 50.3 KCAS: VREF moves to stay above 1.3 VS0.
    if (speed.code === 'VREF' && speed.kind === 'scaled') speed.referenceKt = 65;
  }
  content.speeds.push({ code: 'VAPP', label: 'Approach, flaps 10°', phase: 'approach', configurationKey: 'takeoff-flap', basis: 'ias', kind: 'scaled', referenceKt: 68 });
  content.limits.vfeKt['landing-flap'] = 87;
  content.notes = `${DEMO_NOTES} Revision 2 corrects VR, VX, VREF and the flaps-30° VFE.`;
  return content;
}

/** A twin turboprop. */
export function demoTwinTurbopropContent(): RevisionContent {
  const byWeightKg = [3600, 4800, 5700];
  const byPressureAltitudeFt = [-1000, 4000, 8000];
  return {
    schemaVersion: 1,
    aircraft: { category: 'turboprop', engines: 2, ceilingFt: 30000 },
    weights: { minimumKg: 3600, maximumTakeoffKg: 5700, maximumLandingKg: 5500, referenceKg: 5700 },
    configurations: [
      {
        key: 'clean',
        label: 'Flaps up, gear up',
        // Invented demo data — not for flight: climb speeds +10 kt in icing conditions.
        iceIncrementKt: 10,
        positionError: [
          { iasKt: 65, casKt: 70 },
          { iasKt: 90, casKt: 92 },
          { iasKt: 120, casKt: 121 },
          { iasKt: 150, casKt: 149 },
          { iasKt: 180, casKt: 178 },
          { iasKt: 210, casKt: 207 },
          { iasKt: 240, casKt: 236 },
          { iasKt: 260, casKt: 255 },
        ],
      },
      {
        key: 'takeoff-flap',
        label: 'Flaps approach',
        positionError: [
          { iasKt: 65, casKt: 70 },
          { iasKt: 80, casKt: 83 },
          { iasKt: 100, casKt: 101 },
          { iasKt: 120, casKt: 120 },
          { iasKt: 140, casKt: 139 },
          { iasKt: 160, casKt: 158 },
          { iasKt: 180, casKt: 177 },
        ],
      },
      {
        key: 'landing-flap',
        label: 'Flaps down, gear down',
        // Invented demo data — not for flight: approach and landing speeds +10 kt in icing conditions.
        iceIncrementKt: 10,
        positionError: [
          { iasKt: 55, casKt: 61 },
          { iasKt: 75, casKt: 78 },
          { iasKt: 90, casKt: 91 },
          { iasKt: 110, casKt: 110 },
          { iasKt: 130, casKt: 129 },
          { iasKt: 150, casKt: 148 },
        ],
      },
    ],
    speeds: [
      { code: 'VS1', label: 'Stall, flaps up', phase: 'any', configurationKey: 'clean', basis: 'ias', kind: 'scaled', referenceKt: 88 },
      { code: 'VS0', label: 'Stall, landing configuration', phase: 'landing', configurationKey: 'landing-flap', basis: 'ias', kind: 'scaled', referenceKt: 74 },
      {
        code: 'V1', label: 'Decision speed', phase: 'takeoff', configurationKey: 'takeoff-flap', basis: 'ias', kind: 'tabulated',
        byWeightKg, byPressureAltitudeFt, valuesKt: [[98, 96, 94], [102, 100, 98], [106, 104, 102]],
      },
      {
        code: 'VR', label: 'Rotate', phase: 'takeoff', configurationKey: 'takeoff-flap', basis: 'ias', kind: 'tabulated',
        byWeightKg, byPressureAltitudeFt, valuesKt: [[101, 99, 97], [106, 104, 102], [111, 109, 107]],
      },
      // V2 by weight: at least VR and 1.1 × VMC (97.3 KCAS) at every weight.
      { code: 'V2', label: 'Takeoff safety speed', phase: 'takeoff', configurationKey: 'takeoff-flap', basis: 'ias', kind: 'tabulated', byWeightKg, valuesKt: [106, 112, 118] },
      { code: 'VY', label: 'Best rate of climb', phase: 'climb', configurationKey: 'clean', basis: 'ias', kind: 'scaled', referenceKt: 125 },
      // VREF by landing weight: 1.3 × VS0, and never below VMC (88.5 KCAS) at light weights.
      { code: 'VREF', label: 'Final approach', phase: 'landing', configurationKey: 'landing-flap', basis: 'ias', kind: 'tabulated', byWeightKg: [3600, 4600, 5500], valuesKt: [92, 97, 104] },
    ],
    limits: { vmoKt: 245, mmo: 0.55, vfeKt: { 'takeoff-flap': 175, 'landing-flap': 145 }, vleKt: 175, vloKt: 160, vmcKt: 86, vyseKt: 112, demonstratedCrosswindKt: 25, maximumTailwindKt: 10 },
    indicatorMarkingBasis: 'ias',
    envelope: {
      takeoff: { pressureAltitudeFt: { min: -1000, max: 8000 }, oatC: { min: -40, max: 50 } },
      landing: { pressureAltitudeFt: { min: -1000, max: 8000 }, oatC: { min: -40, max: 50 } },
    },
    notes: DEMO_NOTES,
  };
}

/** A light twin-jet; takeoff speeds tabulated in CAS against weight, altitude and OAT. */
export function demoLightTwinJetContent(): RevisionContent {
  const tables = {
    byWeightKg: [3100, 4100, 4800],
    byPressureAltitudeFt: [-1000, 5000, 10000],
    byOatC: [-40, 15, 50],
  };
  return {
    schemaVersion: 1,
    aircraft: { category: 'jet', engines: 2, ceilingFt: 41000 },
    weights: { minimumKg: 3100, maximumTakeoffKg: 4800, maximumLandingKg: 4400, referenceKg: 4800 },
    configurations: [
      {
        key: 'clean',
        label: 'Flaps up, gear up',
        positionError: [
          { iasKt: 70, casKt: 75 },
          { iasKt: 80, casKt: 84 },
          { iasKt: 110, casKt: 111 },
          { iasKt: 140, casKt: 140 },
          { iasKt: 180, casKt: 179 },
          { iasKt: 220, casKt: 218 },
          { iasKt: 260, casKt: 257 },
          { iasKt: 290, casKt: 286 },
        ],
      },
      {
        key: 'takeoff-flap',
        label: 'Flaps 15°',
        positionError: [
          { iasKt: 80, casKt: 84 },
          { iasKt: 100, casKt: 102 },
          { iasKt: 120, casKt: 121 },
          { iasKt: 140, casKt: 140 },
          { iasKt: 170, casKt: 169 },
          { iasKt: 200, casKt: 198 },
        ],
      },
      {
        key: 'landing-flap',
        label: 'Flaps 35°, gear down',
        positionError: [
          { iasKt: 55, casKt: 63 },
          { iasKt: 65, casKt: 71 },
          { iasKt: 85, casKt: 88 },
          { iasKt: 100, casKt: 101 },
          { iasKt: 120, casKt: 120 },
          { iasKt: 140, casKt: 139 },
          { iasKt: 160, casKt: 158 },
          { iasKt: 180, casKt: 177 },
        ],
      },
    ],
    speeds: [
      { code: 'VS1', label: 'Stall, flaps up', phase: 'any', configurationKey: 'clean', basis: 'ias', kind: 'scaled', referenceKt: 102 },
      { code: 'VS0', label: 'Stall, landing configuration', phase: 'landing', configurationKey: 'landing-flap', basis: 'ias', kind: 'scaled', referenceKt: 84 },
      {
        code: 'V1', label: 'Decision speed', phase: 'takeoff', configurationKey: 'takeoff-flap', basis: 'cas', kind: 'tabulated', ...tables,
        valuesKt: [
          [[96, 97, 98], [97, 98, 99], [98, 99, 101]],
          [[101, 102, 103], [102, 103, 104], [103, 104, 106]],
          [[106, 107, 108], [107, 108, 109], [108, 109, 111]],
        ],
      },
      {
        code: 'VR', label: 'Rotate', phase: 'takeoff', configurationKey: 'takeoff-flap', basis: 'cas', kind: 'tabulated', ...tables,
        valuesKt: [
          [[99, 100, 101], [100, 101, 102], [101, 102, 104]],
          [[104, 105, 106], [105, 106, 107], [106, 107, 109]],
          [[109, 110, 111], [110, 111, 112], [111, 112, 114]],
        ],
      },
      // V2 by weight: above every VR of that weight and 1.1 × VMC (104.3 KCAS).
      { code: 'V2', label: 'Takeoff safety speed', phase: 'takeoff', configurationKey: 'takeoff-flap', basis: 'cas', kind: 'tabulated', byWeightKg: [3100, 4100, 4800], valuesKt: [108, 113, 118] },
      // VREF by landing weight: 1.3 × VS0, and never below VMC (94.8 KCAS) at light weights.
      { code: 'VREF', label: 'Final approach, flaps 35°', phase: 'landing', configurationKey: 'landing-flap', basis: 'ias', kind: 'tabulated', byWeightKg: [3100, 3800, 4400], valuesKt: [100, 105, 110] },
    ],
    limits: { vmoKt: 275, mmo: 0.7, vfeKt: { 'takeoff-flap': 195, 'landing-flap': 170 }, vleKt: 190, vloKt: 190, vmcKt: 92, vyseKt: 150, demonstratedCrosswindKt: 24, maximumTailwindKt: 10 },
    indicatorMarkingBasis: 'ias',
    envelope: {
      takeoff: { pressureAltitudeFt: { min: -1000, max: 10000 }, oatC: { min: -40, max: 50 } },
      landing: { pressureAltitudeFt: { min: -1000, max: 10000 }, oatC: { min: -40, max: 50 } },
    },
    notes: DEMO_NOTES,
  };
}
