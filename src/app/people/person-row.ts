import { utcDateTime } from '../core/format/display-format';
import { OperatorPerson } from '@shared/api/auth';
import { ROLE_LABELS } from '@shared/auth/roles';
import type { ListTableRow } from '../core/table/list-table-state';

/** A person as the people table shows, sorts and filters them. */
export interface PersonRow extends ListTableRow {
  readonly displayName: string;
  readonly email: string;
  readonly roleLabel: string;
  readonly locked: boolean;
  readonly invitationPending: boolean;
  readonly accountLabel: string;
  /** Milliseconds since the epoch, or null when the person never signed in. */
  readonly lastSignInMs: number | null;
  readonly lastSignInLabel: string;
}

/** Times in UTC, as flight operations keep them. */
export function toPersonRow(person: OperatorPerson): PersonRow {
  const lastSignInMs = person.lastSignInAt === null ? null : Date.parse(person.lastSignInAt);
  const known = lastSignInMs !== null && Number.isFinite(lastSignInMs);
  return {
    id: person.id,
    displayName: person.displayName,
    email: person.email,
    roleLabel: ROLE_LABELS[person.role],
    locked: person.locked,
    invitationPending: person.invitationPending,
    accountLabel: accountLabel(person),
    lastSignInMs: known ? lastSignInMs : null,
    lastSignInLabel:
      person.lastSignInAt === null ? 'Never' : known ? utcDateTime(person.lastSignInAt) : 'Not recorded',
    // Lines apart, so a filter never matches across two fields.
    searchText: [person.displayName, person.email, ROLE_LABELS[person.role], accountLabel(person)].join('\n').toLowerCase(),
    // Never signed in counts as the oldest.
    sortKeys: { displayName: person.displayName, roleLabel: ROLE_LABELS[person.role], accountLabel: accountLabel(person), lastSignIn: known ? lastSignInMs : Number.MIN_SAFE_INTEGER },
  };
}

/** A lock is what an admin acts on first, so it outranks a pending invitation. */
function accountLabel(person: OperatorPerson): string {
  if (person.locked) return 'Locked';
  if (person.invitationPending) return 'Invited, no password yet';
  return 'Active';
}
