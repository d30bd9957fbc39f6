/**
 * The book's declared envelope against the day: a day outside it is refused in one sentence
 * (issue 11: nothing the review accepts is refused inside the envelope, nothing outside is
 * guessed).
 */
import { formatRange, formatWhole, type BookEnvelope, type PhaseEnvelope } from '../speed-book/envelope';
import type { CardInputs } from './card';
import type { Aerodrome } from './card-atmosphere';
import { refuse } from './card-refusal';
import { round1 } from './card-rounding';

/**
 * Refuses a day outside the book's envelope in one sentence: the departure against the takeoff
 * envelope, the arrival (or, without one, the departure) against the landing envelope.
 */
export function checkEnvelope(envelope: BookEnvelope, departure: Aerodrome, arrival: Aerodrome | null, inputs: CardInputs): void {
  checkPhaseEnvelope(envelope.takeoff, departure, 'departure', 'takeoff');
  if (arrival) checkPhaseEnvelope(envelope.landing, arrival, 'arrival', 'landing');
  else if (inputs.arrival === undefined) checkPhaseEnvelope(envelope.landing, departure, 'departure', 'landing');
}

/** Refuses `where` outside one phase's envelope (pressure altitude, then temperature). */
export function checkPhaseEnvelope(envelope: PhaseEnvelope, where: Aerodrome, field: 'departure' | 'arrival', phase: 'takeoff' | 'landing'): void {
  const [lowFt, highFt] = envelope.pressureAltitudeFt;
  const place = field === 'departure' ? 'departure' : 'arrival';
  const altitudeFt = where.pressureAltitudeFt;
  if (altitudeFt < lowFt - 0.5 || altitudeFt > highFt + 0.5) {
    refuse(
      'outside-book-envelope',
      `${field}.elevationFt`,
      `The day is outside this book's ${phase} envelope: the ${place} pressure altitude of ${formatWhole(altitudeFt)} ft is ${altitudeFt > highFt ? 'above' : 'below'} its range of ${formatRange(envelope.pressureAltitudeFt, 'ft')}.`,
    );
  }
  const [lowC, highC] = envelope.oatC;
  if (where.oatC < lowC || where.oatC > highC) {
    refuse(
      'outside-book-envelope',
      `${field}.oatC`,
      `The day is outside this book's ${phase} envelope: the ${place} temperature of ${round1(where.oatC)} °C is ${where.oatC > highC ? 'above' : 'below'} its range of ${formatRange(envelope.oatC, '°C')}.`,
    );
  }
}
