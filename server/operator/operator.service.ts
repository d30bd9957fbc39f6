import type { OperatorSettings } from '../../shared/api/sync';
import type { Actor } from '../audit/actor';
import { recordAudit } from '../audit/audit.service';
import { Operator } from '../models';
import { transact } from '../transactions';

/** The operator's policies as its administrator sees them. */
export async function operatorSettings(operatorId: number): Promise<OperatorSettings> {
  const operator = await Operator.findByPk(operatorId, { rejectOnEmpty: true });
  return { currencyLimitDays: operator.currencyLimitDays };
}

/**
 * Changes the operator's policies. The operator row is locked for the change, and the audit
 * event (before and after) is written in the same transaction.
 */
export async function updateOperatorSettings(actor: Actor, input: OperatorSettings): Promise<OperatorSettings> {
  return transact(async (transaction) => {
    const operator = await Operator.findByPk(actor.operatorId, { transaction, lock: transaction.LOCK.UPDATE, rejectOnEmpty: true });
    const before = operator.currencyLimitDays;
    await operator.update({ currencyLimitDays: input.currencyLimitDays }, { transaction });
    await recordAudit(
      {
        operatorId: actor.operatorId,
        actorId: actor.userId,
        action: 'operator.settings-updated',
        entityType: 'operator',
        entityId: actor.operatorId,
        details: { currencyLimitDays: { before, after: input.currencyLimitDays } },
        origin: actor.origin,
      },
      transaction,
    );
    return { currencyLimitDays: operator.currencyLimitDays };
  });
}
