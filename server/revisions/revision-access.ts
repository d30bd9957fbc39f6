/**
 * Who may see which revision: the one visibility rule, used by the revisions, attachments,
 * speed-books and card services alike. Drafts and revisions in review are for the people who
 * write and approve them; everyone of the operator sees what was ever published. A revision the
 * viewer may not see answers as one that does not exist (404), so its existence is not told.
 */
import type { RevisionStatus } from '@shared/api/revisions';
import { can, type Role } from '@shared/auth/roles';
import { notFound } from '../errors/domain-error';
import { Revision } from '../models';

export interface Viewer {
  operatorId: number;
  role: Role;
}

export const OPEN_STATUSES: RevisionStatus[] = ['draft', 'in_review'];
export const EVER_PUBLISHED_STATUSES: RevisionStatus[] = ['published', 'superseded', 'withdrawn'];

/** Drafts and revisions in review are for the people who write and approve them. */
export const seesOpenRevisions = (role: Role) => can(role, 'edit-speed-books');

/** Whether a viewer with `role` may see a revision in `status`. */
export const maySeeRevision = (role: Role, status: RevisionStatus) => !OPEN_STATUSES.includes(status) || seesOpenRevisions(role);

/** The statuses a viewer may see, as a `where` condition (none when they see every status). */
export const visibleStatusFilter = (role: Role): { status?: RevisionStatus[] } => (seesOpenRevisions(role) ? {} : { status: EVER_PUBLISHED_STATUSES });

/** The revision `id` of the viewer's operator if the viewer may see it; else a 404 naming `what`. */
export async function visibleRevision(viewer: Viewer, id: number, what = 'That revision'): Promise<Revision> {
  const revision = await Revision.findOne({ where: { id, operatorId: viewer.operatorId } });
  if (!revision || !maySeeRevision(viewer.role, revision.status)) throw notFound(what);
  return revision;
}
