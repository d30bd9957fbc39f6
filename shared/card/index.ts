/** The speed card model: types, inputs schema, refusal, `buildCard` and `cardDigest`. */
export * from './card';
export { buildCard, takeoffConfigurationKeys, HIGH_DENSITY_ALTITUDE_ABOVE_FIELD_FT, HIGH_DENSITY_ALTITUDE_FT } from './build-card';
export * from './coverage-report';
export { sweepEnvelope, type SweepOptions } from './coverage';
export { ORDERING_RULES, orderingRule, type OrderingRule, type OrderingRuleId } from './ordering-rules';
export { cardDigest } from './card-digest';
export * from './card-api';
export { EN_ROUTE_DEVIATION_CONFIRM_C, enRouteDeviationCheck, isaDeviationFromTat, startingEnRouteDeviationC, type TatReading } from './en-route-deviation';
export {
  APPROACH_ADDITIVE_BOUNDS_KT,
  COMMON_PRACTICE_APPROACH_POLICY,
  approachAdditivePolicySchema,
  approachPolicyStatement,
  type ApproachAdditivePolicy,
} from './approach-policy';
export { cardApproach, cardWind, roundAdditiveUpKt, unroundedAdditiveKt, windComponents, type WindComponents } from './card-wind';
export { cardIcing, ICED_SPEED_CLASSES, takesIceIncrement } from './card-icing';
