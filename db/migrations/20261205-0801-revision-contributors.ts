import { DataTypes, QueryTypes } from 'sequelize';
import type { Migration } from '../migration';

/**
 * Everyone who contributed to a revision, one row per person and kind of contribution
 * (`created`, `edited`, `attachments`, `submitted`): the four-eyes rule refuses approval to any
 * of them (server/revisions/revision-contributors.ts). Rows go with their revision when a draft
 * is discarded.
 *
 * Revisions written before this migration get what is known of them: the author as creator,
 * and from the audit trail and the source pages whoever changed, submitted or attached pages.
 */
export const up: Migration = async ({ context: queryInterface }) => {
  await queryInterface.createTable('revision_contributors', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    operator_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'operators', key: 'id' }, onDelete: 'RESTRICT' },
    revision_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'revisions', key: 'id' }, onDelete: 'CASCADE' },
    user_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'RESTRICT' },
    kind: { type: DataTypes.ENUM('created', 'edited', 'attachments', 'submitted'), allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await queryInterface.addIndex('revision_contributors', ['revision_id', 'user_id', 'kind'], { name: 'revision_contributors_once', unique: true });
  await queryInterface.addIndex('revision_contributors', ['user_id']);

  // INSERT … SELECT reads affectedRows only (not RAW: DEVELOPERS.md, pitfalls).
  const sql = (text: string) => queryInterface.sequelize.query(text, { type: QueryTypes.INSERT });
  await sql(
    `INSERT IGNORE INTO revision_contributors (operator_id, revision_id, user_id, kind, created_at)
     SELECT operator_id, id, author_id, 'created', created_at FROM revisions`,
  );
  const fromAudit = (action: string, kind: string) =>
    sql(
      `INSERT IGNORE INTO revision_contributors (operator_id, revision_id, user_id, kind, created_at)
       SELECT r.operator_id, r.id, a.actor_id, '${kind}', MIN(a.created_at)
       FROM audit_events a JOIN revisions r ON a.entity_id = CAST(r.id AS CHAR) AND a.operator_id = r.operator_id
       JOIN users u ON u.id = a.actor_id
       WHERE a.entity_type = 'revision' AND a.action = '${action}' AND a.actor_id IS NOT NULL
       GROUP BY r.operator_id, r.id, a.actor_id`,
    );
  await fromAudit('revision.submitted', 'submitted');
  await fromAudit('revision.updated', 'edited');
  await sql(
    `INSERT IGNORE INTO revision_contributors (operator_id, revision_id, user_id, kind, created_at)
     SELECT operator_id, revision_id, uploaded_by_id, 'attachments', MIN(created_at)
     FROM attachments WHERE uploaded_by_id IS NOT NULL GROUP BY operator_id, revision_id, uploaded_by_id`,
  );
  // Pages added and removed again are gone from attachments; the audit trail names their revision.
  await sql(
    `INSERT IGNORE INTO revision_contributors (operator_id, revision_id, user_id, kind, created_at)
     SELECT r.operator_id, r.id, a.actor_id, 'attachments', MIN(a.created_at)
     FROM audit_events a JOIN revisions r ON r.id = JSON_VALUE(a.details, '$.revisionId') AND a.operator_id = r.operator_id
     JOIN users u ON u.id = a.actor_id
     WHERE a.entity_type = 'attachment' AND a.action IN ('attachment.added', 'attachment.removed') AND a.actor_id IS NOT NULL
     GROUP BY r.operator_id, r.id, a.actor_id`,
  );
};

export const down: Migration = async ({ context: queryInterface }) => {
  await queryInterface.dropTable('revision_contributors');
};
