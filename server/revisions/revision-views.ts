import type { RevisionContributorView, RevisionStatus, RevisionSummary, RevisionView } from '@shared/api/revisions';
import { revisionContentProblems } from '@shared/speed-book/revision-content';
import { Revision, User } from '../models';
import { OPEN_STATUSES } from './revision-access';

/** Display names of the people a list of revisions mentions, by id. */
export async function peopleNames(operatorId: number, revisions: Revision[]): Promise<Map<number, string>> {
  const ids = new Set<number>();
  for (const revision of revisions) {
    ids.add(revision.authorId);
    if (revision.approverId) ids.add(revision.approverId);
  }
  if (ids.size === 0) return new Map();
  const people = await User.findAll({ where: { id: [...ids], operatorId }, attributes: ['id', 'displayName'] });
  return new Map(people.map((person) => [person.id, person.displayName]));
}

const iso = (date: Date | null) => date?.toISOString() ?? null;

export function revisionSummary(revision: Revision, names: Map<number, string>): RevisionSummary {
  return {
    id: revision.id,
    speedBookId: revision.speedBookId,
    number: revision.number,
    status: revision.status,
    changeSummary: revision.changeSummary,
    authorId: revision.authorId,
    authorName: names.get(revision.authorId) ?? '',
    submittedAt: iso(revision.submittedAt),
    approverId: revision.approverId,
    approverName: revision.approverId ? (names.get(revision.approverId) ?? '') : null,
    publishedAt: iso(revision.publishedAt),
    supersededAt: iso(revision.supersededAt),
    withdrawnAt: iso(revision.withdrawnAt),
    contentSha256: revision.contentSha256,
    createdAt: revision.createdAt.toISOString(),
    updatedAt: revision.updatedAt.toISOString(),
  };
}


export function revisionDetail(revision: Revision, names: Map<number, string>, contributors: RevisionContributorView[]): RevisionView {
  const content = JSON.parse(revision.content) as Record<string, unknown>;
  return {
    ...revisionSummary(revision, names),
    content,
    returnedAt: iso(revision.returnedAt),
    returnReason: revision.returnReason,
    withdrawnById: revision.withdrawnById,
    withdrawReason: revision.withdrawReason,
    signature: revision.signature,
    signingKeyId: revision.signingKeyId,
    problems: OPEN_STATUSES.includes(revision.status) ? revisionContentProblems(content) : {},
    contributors,
  };
}

const STATUS_WORDS: Record<RevisionStatus, string> = {
  draft: 'a draft',
  in_review: 'in review',
  published: 'published',
  superseded: 'superseded',
  withdrawn: 'withdrawn',
};

export function statusWords(status: RevisionStatus): string {
  return STATUS_WORDS[status];
}
