/**
 * The operator's approach additive policy as the `operators` row keeps it (four columns) and as
 * the API, the sync and the card inputs carry it (`ApproachAdditivePolicy`).
 */
import type { ApproachAdditivePolicy } from '@shared/card/approach-policy';
import type { Operator } from '../models';

/** The policy of an operator row. */
export function approachPolicyOf(operator: Operator): ApproachAdditivePolicy {
  return {
    headwindFraction: operator.approachHeadwindFraction,
    gustFraction: operator.approachGustFraction,
    minimumKt: operator.approachAdditiveMinimumKt,
    maximumKt: operator.approachAdditiveMaximumKt,
  };
}

/** The row's columns for a policy (for `operator.update`). */
export function approachPolicyColumns(policy: ApproachAdditivePolicy) {
  return {
    approachHeadwindFraction: policy.headwindFraction,
    approachGustFraction: policy.gustFraction,
    approachAdditiveMinimumKt: policy.minimumKt,
    approachAdditiveMaximumKt: policy.maximumKt,
  };
}
