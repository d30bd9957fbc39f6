/**
 * Every demo book is sound (issue 11): random points inside its declared envelope always give a
 * card, every ordering rule holds on it, and an ordinary day — a field from sea level to
 * 5,000 ft, QNH 980–1040 hPa, OAT −35…+45 °C — is never refused. Property tests (fast-check).
 */
import fc from 'fast-check';
import { isaDeviationC, pressureAltitudeFt } from '../aero';
import { startingEnRouteDeviationC } from './en-route-deviation';
import { demoLightTwinJetContent, demoPistonTrainerContent, demoPistonTrainerContentRevised, demoTwinTurbopropContent } from '../speed-book/demo-content';
import { revisionContentSchema, type RevisionContent } from '../speed-book/revision-content';
import { buildCard, cardFigures, takeoffConfigurationKeys } from './build-card';
import type { CardInputs } from './card';
import { sweepEnvelope } from './coverage';
import { HAND_CONTEXT, revisionOf } from './testing/test-fixtures';

const BOOKS: ReadonlyArray<readonly [string, () => RevisionContent]> = [
  ['piston trainer', demoPistonTrainerContent],
  ['piston trainer, revision 2', demoPistonTrainerContentRevised],
  ['twin turboprop', demoTwinTurbopropContent],
  ['light twin-jet', demoLightTwinJetContent],
];

const inputsAt = (content: RevisionContent, configuration: string, weightKg: number, elevationFt: number, qnhHpa: number, oatC: number, cruise: CardInputs['cruise']): CardInputs => ({
  airframeId: HAND_CONTEXT.airframe.id,
  weightKg,
  configuration,
  departure: { elevationFt, qnhHpa, oatC },
  isaDeviationC: 0,
  cruise,
  altitudeStepFt: 5000,
});

describe.each(BOOKS)('the demo %s', (_name, make) => {
  const content = revisionContentSchema.parse(make());
  const revision = revisionOf(content);
  const envelope = content.envelope!;
  const keys = takeoffConfigurationKeys(content);
  const { minimumKg, maximumTakeoffKg } = content.weights;

  it('declares its envelope from −1,000 ft or lower, and passes its own envelope sweep', () => {
    expect(envelope.takeoff.pressureAltitudeFt.min).toBeLessThanOrEqual(-1000);
    expect(envelope.landing.pressureAltitudeFt.min).toBeLessThanOrEqual(-1000);
    const report = sweepEnvelope(content);
    expect(report.counts.refused).toBe(0);
    expect(report.rules).toEqual([]);
    expect(report.passes).toBe(true);
  });

  it('gives a card at random points inside its declared envelope, with every ordering rule kept (property)', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...keys),
        fc.double({ min: minimumKg, max: maximumTakeoffKg, noNaN: true }),
        fc.double({ min: envelope.takeoff.pressureAltitudeFt.min, max: envelope.takeoff.pressureAltitudeFt.max, noNaN: true }),
        fc.double({ min: envelope.takeoff.oatC.min, max: envelope.takeoff.oatC.max, noNaN: true }),
        (configuration, weightKg, altitudeFt, oatC) => {
          // A standard QNH makes the field's pressure altitude its elevation (ICAO Doc 7488 altimeter law).
          const inputs = inputsAt(content, configuration, weightKg, altitudeFt, 1013.25, oatC, { mach: 0.3 });
          const card = buildCard(revision, inputs, HAND_CONTEXT); // throws (fails) on any refusal or broken rule
          expect(card.speeds.length).toBeGreaterThan(0);
          expect(cardFigures(content, inputs, { phase: 'takeoff' }).violations).toEqual([]);
          expect(cardFigures(content, { ...inputs, arrival: inputs.departure, landingWeightKg: Math.min(weightKg, content.weights.maximumLandingKg) }, { phase: 'landing' }).violations).toEqual([]);
        },
      ),
      { numRuns: 150 },
    );
  });

  it('gives a card with icing conditions at random points inside its declared envelope, iced speeds above the normal ones (property)', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...keys),
        fc.double({ min: minimumKg, max: maximumTakeoffKg, noNaN: true }),
        fc.double({ min: envelope.takeoff.pressureAltitudeFt.min, max: envelope.takeoff.pressureAltitudeFt.max, noNaN: true }),
        fc.double({ min: envelope.takeoff.oatC.min, max: envelope.takeoff.oatC.max, noNaN: true }),
        (configuration, weightKg, altitudeFt, oatC) => {
          const inputs = { ...inputsAt(content, configuration, weightKg, altitudeFt, 1013.25, oatC, { mach: 0.3 }), icing: true };
          const card = buildCard(revision, inputs, HAND_CONTEXT); // throws (fails) on any refusal or broken rule
          for (const speed of card.icing!.speeds) expect(speed.icedIasKt).toBe(speed.iasKt + speed.incrementKt);
        },
      ),
      { numRuns: 100 },
    );
  });

  it('never refuses an ordinary day: sea level to 5,000 ft, QNH 980–1040 hPa, OAT −35…+45 °C (property)', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...keys),
        fc.double({ min: minimumKg, max: maximumTakeoffKg, noNaN: true }),
        fc.double({ min: 0, max: 5000, noNaN: true }),
        fc.double({ min: 980, max: 1040, noNaN: true }),
        fc.double({ min: -35, max: 45, noNaN: true }),
        (configuration, weightKg, elevationFt, qnhHpa, oatC) => {
          expect(pressureAltitudeFt(elevationFt, qnhHpa)).toBeGreaterThanOrEqual(envelope.takeoff.pressureAltitudeFt.min);
          // The en-route deviation as the card form starts it: the departure's own (en-route-deviation.ts).
          const isaDeviationOfDayC = startingEnRouteDeviationC(isaDeviationC(pressureAltitudeFt(elevationFt, qnhHpa), oatC));
          const card = buildCard(revision, { ...inputsAt(content, configuration, weightKg, elevationFt, qnhHpa, oatC, { mach: 0.3 }), isaDeviationC: isaDeviationOfDayC }, HAND_CONTEXT);
          expect(card.landing.weightKg).toBeLessThanOrEqual(content.weights.maximumLandingKg);
        },
      ),
      { numRuns: 150 },
    );
  });
});
