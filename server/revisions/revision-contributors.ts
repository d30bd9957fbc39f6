/**
 * Who contributed to a revision, and the four-eyes rule built on it (shared/speed-book/four-eyes.ts):
 * every service that creates, changes, gives source pages to or submits a revision records its
 * actor here in the same transaction; approving asks `refuseContributor` first.
 */
import type { Transaction } from 'sequelize';
import type { RevisionContributorView } from '@shared/api/revisions';
import { CONTRIBUTION_KINDS, contributionWords, fourEyesRefusal, type ContributionKind } from '@shared/speed-book/four-eyes';
import type { Actor } from '../audit/actor';
import { forbidden } from '../errors/domain-error';
import { RevisionContributor, User } from '../models';

/** Notes that `actor` contributed to the revision in this way (once per person and kind). */
export async function recordContribution(actor: Actor, revisionId: number, kind: ContributionKind, transaction: Transaction): Promise<void> {
  await RevisionContributor.bulkCreate([{ operatorId: actor.operatorId, revisionId, userId: actor.userId, kind }], { transaction, ignoreDuplicates: true });
}

/** The ways `userId` contributed to the revision (empty when not at all). */
export async function contributionsOf(operatorId: number, revisionId: number, userId: number, transaction?: Transaction): Promise<ContributionKind[]> {
  const rows = await RevisionContributor.findAll({ where: { operatorId, revisionId, userId }, attributes: ['kind'], transaction });
  return CONTRIBUTION_KINDS.filter((kind) => rows.some((row) => row.kind === kind));
}

/** 403 with the reason when `actor` contributed to revision `number`; the four-eyes rule. */
export async function refuseContributor(actor: Actor, revision: { id: number; number: number }, transaction: Transaction): Promise<void> {
  const refusal = fourEyesRefusal(revision.number, await contributionsOf(actor.operatorId, revision.id, actor.userId, transaction));
  if (refusal) throw forbidden(refusal);
}

/** Everyone who contributed, in order of their first contribution, with their names. */
export async function revisionContributors(operatorId: number, revisionId: number, transaction?: Transaction): Promise<RevisionContributorView[]> {
  const rows = await RevisionContributor.findAll({ where: { operatorId, revisionId }, order: [['createdAt', 'ASC'], ['id', 'ASC']], transaction });
  const ids = [...new Set(rows.map((row) => row.userId))];
  if (ids.length === 0) return [];
  const people = await User.findAll({ where: { id: ids, operatorId }, attributes: ['id', 'displayName'], transaction });
  const names = new Map(people.map((person) => [person.id, person.displayName]));
  return ids.map((userId) => ({
    userId,
    name: names.get(userId) ?? `Person #${userId}`,
    kinds: CONTRIBUTION_KINDS.filter((kind) => rows.some((row) => row.userId === userId && row.kind === kind)),
  }));
}

/** The contributors as the audit trail's details show them: "Dana Reyes (started it and submitted it)". */
export function contributorsInWords(contributors: readonly RevisionContributorView[]): string[] {
  return contributors.map((contributor) => `${contributor.name} (${contributionWords(contributor.kinds)})`);
}
