import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';

// Fresh objects on every call: Sequelize writes the column name into an attribute's definition,
// so one object must never serve two models.

/** The unsigned auto-increment primary key the migrations give every table but the card log. */
export function idAttribute() {
  return { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true };
}

/** A required reference to another row (an unsigned integer id, as the migrations declare it). */
export function referenceAttribute() {
  return { type: DataTypes.INTEGER.UNSIGNED, allowNull: false };
}

/** Sequelize's own `createdAt` / `updatedAt`, both DATETIME columns in the migrations. */
export function timestampAttributes() {
  return { createdAt: DataTypes.DATE, updatedAt: DataTypes.DATE };
}

/** The columns shared by every row one operator owns: id, operator, timestamps. */
export function operatorRecordAttributes() {
  return { id: idAttribute(), operatorId: referenceAttribute(), ...timestampAttributes() };
}

/**
 * A row one operator owns, with Sequelize's timestamps. `M` is the model class itself, so that
 * `InferAttributes` sees the subclass's own fields as well as these.
 */
export abstract class OperatorRecord<M extends OperatorRecord<M>> extends Model<InferAttributes<M>, InferCreationAttributes<M>> {
  declare id: CreationOptional<number>;
  declare operatorId: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/**
 * Hooks that refuse every update and delete, for the append-only tables (audit trail, card log);
 * `what` names the table in the error, e.g. "Audit events are".
 */
export function appendOnlyHooks(what: string) {
  const refuse = (): never => {
    throw new Error(`${what} append-only.`);
  };
  return { beforeUpdate: refuse, beforeBulkUpdate: refuse, beforeDestroy: refuse, beforeBulkDestroy: refuse };
}
