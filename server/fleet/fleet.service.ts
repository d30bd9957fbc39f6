import { UniqueConstraintError } from 'sequelize';
import type { AircraftTypeView, AirframeView, CreateAircraftType, CreateAirframe, UpdateAircraftType, UpdateAirframe } from '@shared/api/fleet';
import type { Actor } from '../audit/actor';
import { recordAudit } from '../audit/audit.service';
import { DomainError, notFound } from '../errors/domain-error';
import { AircraftType, Airframe } from '../models';
import { transact } from '../transactions';

export function aircraftTypeView(type: AircraftType): AircraftTypeView {
  return {
    id: type.id,
    designator: type.designator,
    name: type.name,
    category: type.category,
    engines: type.engines,
    ceilingFt: type.ceilingFt,
    createdAt: type.createdAt.toISOString(),
    updatedAt: type.updatedAt.toISOString(),
  };
}

export function airframeView(airframe: Airframe): AirframeView {
  return {
    id: airframe.id,
    registration: airframe.registration,
    serial: airframe.serial,
    aircraftTypeId: airframe.aircraftTypeId,
    active: airframe.active,
    createdAt: airframe.createdAt.toISOString(),
    updatedAt: airframe.updatedAt.toISOString(),
  };
}

/** The before and after of each field an update changed, for the audit trail. */
function changes(before: Record<string, unknown>, after: Record<string, unknown>): Record<string, { before: unknown; after: unknown }> {
  const out: Record<string, { before: unknown; after: unknown }> = {};
  for (const key of Object.keys(after)) if (before[key] !== after[key]) out[key] = { before: before[key], after: after[key] };
  return out;
}

function duplicate(error: unknown, field: string, message: string): never {
  if (error instanceof UniqueConstraintError) throw new DomainError('conflict', 'duplicate', message, { [field]: message });
  throw error;
}

export async function listAircraftTypes(operatorId: number): Promise<AircraftTypeView[]> {
  const types = await AircraftType.findAll({ where: { operatorId }, order: [['designator', 'ASC']] });
  return types.map(aircraftTypeView);
}

export async function findAircraftType(operatorId: number, id: number): Promise<AircraftType> {
  const type = await AircraftType.findOne({ where: { id, operatorId } });
  if (!type) throw notFound('That aircraft type');
  return type;
}

export async function getAircraftType(operatorId: number, id: number): Promise<AircraftTypeView> {
  return aircraftTypeView(await findAircraftType(operatorId, id));
}

export async function createAircraftType(actor: Actor, input: CreateAircraftType): Promise<AircraftTypeView> {
  try {
    return await transact(async (transaction) => {
      const type = await AircraftType.create({ ...input, operatorId: actor.operatorId }, { transaction });
      await recordAudit(
        { operatorId: actor.operatorId, actorId: actor.userId, action: 'aircraft-type.created', entityType: 'aircraft-type', entityId: type.id, details: { ...input }, origin: actor.origin },
        transaction,
      );
      return aircraftTypeView(type);
    });
  } catch (error) {
    return duplicate(error, 'designator', `The designator ${input.designator} is already one of your types.`);
  }
}

export async function updateAircraftType(actor: Actor, id: number, input: UpdateAircraftType): Promise<AircraftTypeView> {
  try {
    return await transact(async (transaction) => {
      const type = await AircraftType.findOne({ where: { id, operatorId: actor.operatorId }, transaction, lock: transaction.LOCK.UPDATE });
      if (!type) throw notFound('That aircraft type');
      const before = aircraftTypeView(type);
      await type.update(input, { transaction });
      await recordAudit(
        { operatorId: actor.operatorId, actorId: actor.userId, action: 'aircraft-type.updated', entityType: 'aircraft-type', entityId: id, details: changes(before, input), origin: actor.origin },
        transaction,
      );
      return aircraftTypeView(type);
    });
  } catch (error) {
    return duplicate(error, 'designator', `The designator ${input.designator ?? ''} is already one of your types.`);
  }
}

export async function listAirframes(operatorId: number): Promise<AirframeView[]> {
  const airframes = await Airframe.findAll({ where: { operatorId }, order: [['registration', 'ASC']] });
  return airframes.map(airframeView);
}

export async function getAirframe(operatorId: number, id: number): Promise<AirframeView> {
  const airframe = await Airframe.findOne({ where: { id, operatorId } });
  if (!airframe) throw notFound('That airframe');
  return airframeView(airframe);
}

/** A type named in a request body must be one of the operator's; another's is as unknown as none. */
async function requireOwnType(operatorId: number, aircraftTypeId: number | undefined): Promise<void> {
  if (aircraftTypeId === undefined) return;
  if (!(await AircraftType.findOne({ where: { id: aircraftTypeId, operatorId } }))) {
    throw new DomainError('refused', 'unknown_reference', 'That aircraft type does not exist.', { aircraftTypeId: 'Choose one of your aircraft types.' });
  }
}

export async function createAirframe(actor: Actor, input: CreateAirframe): Promise<AirframeView> {
  await requireOwnType(actor.operatorId, input.aircraftTypeId);
  try {
    return await transact(async (transaction) => {
      const airframe = await Airframe.create({ ...input, operatorId: actor.operatorId }, { transaction });
      await recordAudit(
        { operatorId: actor.operatorId, actorId: actor.userId, action: 'airframe.created', entityType: 'airframe', entityId: airframe.id, details: { ...input }, origin: actor.origin },
        transaction,
      );
      return airframeView(airframe);
    });
  } catch (error) {
    return duplicate(error, 'registration', `${input.registration} is already in your fleet.`);
  }
}

export async function updateAirframe(actor: Actor, id: number, input: UpdateAirframe): Promise<AirframeView> {
  try {
    return await transact(async (transaction) => {
      const airframe = await Airframe.findOne({ where: { id, operatorId: actor.operatorId }, transaction, lock: transaction.LOCK.UPDATE });
      if (!airframe) throw notFound('That airframe');
      await requireOwnType(actor.operatorId, input.aircraftTypeId);
      const before = airframeView(airframe);
      await airframe.update(input, { transaction });
      await recordAudit(
        { operatorId: actor.operatorId, actorId: actor.userId, action: 'airframe.updated', entityType: 'airframe', entityId: id, details: changes(before, input), origin: actor.origin },
        transaction,
      );
      return airframeView(airframe);
    });
  } catch (error) {
    return duplicate(error, 'registration', `${input.registration ?? ''} is already in your fleet.`);
  }
}
