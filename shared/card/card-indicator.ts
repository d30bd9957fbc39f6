/**
 * The airspeed indicator's markings at this card's weight: arcs and radial lines on the basis
 * the speed book states (14 CFR 23.1545, from memory), with the card's stall speeds; drawn by
 * indicator-geometry.ts.
 */
import type { RevisionContent } from '../speed-book/revision-content';
import { speedRole } from '../speed-book/speed-class';
import type { CardIndicator, CardIndicatorArc, CardIndicatorLine, CardLimitSpeed, CardSpeed } from './card';
import type { ComputedLimits } from './card-limits';
import type { ComputedSpeed } from './card-speeds';

/** Arcs and radial lines on the basis the speed book states, with this card's stall speeds. */
export function cardIndicator(content: RevisionContent, speeds: readonly ComputedSpeed[], limits: ComputedLimits): CardIndicator {
  const basis = content.indicatorMarkingBasis;
  const inBasis = (speed: CardLimitSpeed | CardSpeed | null | undefined) =>
    speed ? (basis === 'ias' ? speed.iasKt : speed.casKt) : null;
  const stallSpeed = (role: string) => speeds.find((speed) => speedRole(speed.card.code) === role);
  const vs0Speed = stallSpeed('VS0');
  const vs0 = inBasis(vs0Speed?.card);
  const vs1 = inBasis(stallSpeed('VS1')?.card) ?? inBasis(stallSpeed('VS')?.card);
  // The white arc ends at the VFE of the landing flap (14 CFR 23.1545(b)(1), from memory): the
  // configuration VS0 is given in, else the landing speeds' configuration.
  const landingKey = vs0Speed?.card.configurationKey ?? speeds.find((speed) => speed.card.phase === 'landing')?.card.configurationKey;
  const landingVfe = limits.card.vfe.find((vfe) => vfe.configurationKey === landingKey);
  const vfeTop = landingVfe ? inBasis(landingVfe) : null;
  const vno = inBasis(limits.card.vno);
  const vne = inBasis(limits.card.vne);
  const vmo = inBasis(limits.card.vmo);
  const { category } = content.aircraft;
  const piston = category === 'piston-single' || category === 'piston-twin';

  const arcs: CardIndicatorArc[] = [];
  const arc = (colour: CardIndicatorArc['colour'], fromKt: number | null, toKt: number | null) => {
    if (fromKt !== null && toKt !== null && fromKt < toKt) arcs.push({ colour, fromKt, toKt });
  };
  const lines: CardIndicatorLine[] = [];
  const line = (colour: CardIndicatorLine['colour'], code: CardIndicatorLine['code'], kt: number | null) => {
    if (kt !== null) lines.push({ code, colour, kt });
  };

  arc('white', vs0, vfeTop);
  if (piston) {
    arc('green', vs1, vno);
    arc('yellow', vno, vne);
    line('red', 'VNE', vne);
    if (content.aircraft.engines > 1) {
      line('red', 'VMC', inBasis(limits.card.vmc));
      line('blue', 'VYSE', inBasis(limits.card.vyse));
    }
  } else if (vmo !== null) {
    line('red', 'VMO', vmo);
  } else {
    line('red', 'VNE', vne);
  }
  return { arcs, basis, lines };
}
