import type { OperatorSettings, OperatorSettingsChange } from '@shared/api/sync';
import type { Actor } from '../audit/actor';
import { recordAudit } from '../audit/audit.service';
import { Operator } from '../models';
import { transact } from '../transactions';
import { approachPolicyColumns, approachPolicyOf } from './approach-policy';

/** The operator's policies as its administrator sees them. */
export async function operatorSettings(operatorId: number): Promise<OperatorSettings> {
  const operator = await Operator.findByPk(operatorId, { rejectOnEmpty: true });
  return settingsOf(operator);
}

function settingsOf(operator: Operator): OperatorSettings {
  return { currencyLimitDays: operator.currencyLimitDays, approachAdditivePolicy: approachPolicyOf(operator) };
}

/**
 * Changes the operator's policies (those given; each replaced whole). The operator row is
 * locked for the change, and the audit event (before and after of what changed) is written in
 * the same transaction.
 */
export async function updateOperatorSettings(actor: Actor, input: OperatorSettingsChange): Promise<OperatorSettings> {
  return transact(async (transaction) => {
    const operator = await Operator.findByPk(actor.operatorId, { transaction, lock: transaction.LOCK.UPDATE, rejectOnEmpty: true });
    const before = settingsOf(operator);
    const details: Record<string, { before: unknown; after: unknown }> = {};
    if (input.currencyLimitDays !== undefined) {
      await operator.update({ currencyLimitDays: input.currencyLimitDays }, { transaction });
      details['currencyLimitDays'] = { before: before.currencyLimitDays, after: input.currencyLimitDays };
    }
    if (input.approachAdditivePolicy !== undefined) {
      await operator.update(approachPolicyColumns(input.approachAdditivePolicy), { transaction });
      details['approachAdditivePolicy'] = { before: before.approachAdditivePolicy, after: input.approachAdditivePolicy };
    }
    await recordAudit(
      {
        operatorId: actor.operatorId,
        actorId: actor.userId,
        action: 'operator.settings-updated',
        entityType: 'operator',
        entityId: actor.operatorId,
        details,
        origin: actor.origin,
      },
      transaction,
    );
    return settingsOf(operator);
  });
}
