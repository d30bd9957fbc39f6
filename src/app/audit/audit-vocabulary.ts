/**
 * Plain words for the audit trail's records and actions (the server's `entityType` and
 * `action` values, as `recordAudit` callers name them). An action not listed here is shown
 * as the server wrote it.
 */
export const AUDIT_ENTITY_LABELS: Readonly<Record<string, string>> = {
  user: 'Person',
  'aircraft-type': 'Aircraft type',
  airframe: 'Airframe',
  'speed-book': 'Speed book',
  revision: 'Revision',
  attachment: 'Source page',
  'card-issue': 'Speed card',
  'signing-key': 'Signing key',
  operator: 'Operator',
};

export const AUDIT_ACTION_LABELS: Readonly<Record<string, string>> = {
  'user.invited': 'Invited a person',
  'user.invitation-resent': 'Sent an invitation again',
  'invitation.accepted': 'Accepted the invitation',
  'user.role-changed': 'Changed a role',
  'user.renamed': 'Changed a name',
  'user.locked': 'Locked an account',
  'user.unlocked': 'Unlocked an account',
  'user.password-reset-requested': 'Asked for a password reset',
  'user.password-reset': 'Chose a new password by reset link',
  'user.password-changed': 'Changed their own password',
  'user.password-change-refused': 'Tried to change their password with a wrong current one',
  'user.sign-in-wait-lifted': 'Ended the wait before signing in again',
  'aircraft-type.created': 'Added an aircraft type',
  'aircraft-type.updated': 'Changed an aircraft type',
  'airframe.created': 'Added an airframe',
  'airframe.updated': 'Changed an airframe',
  'speed-book.created': 'Opened a speed book',
  'revision.created': 'Started a draft revision',
  'revision.updated': 'Changed a draft revision',
  'revision.submitted': 'Submitted a revision for review',
  'revision.returned': 'Returned a revision to its author',
  'revision.approved': 'Approved and published a revision',
  'revision.superseded': 'Superseded a revision',
  'revision.withdrawn': 'Withdrew a revision',
  'revision.discarded': 'Discarded a draft revision',
  'attachment.added': 'Attached a source page',
  'attachment.removed': 'Removed a source page',
  'card.issued': 'Issued a speed card',
  'signing-key.created': 'Made the operator’s signing key',
  'signing-key.rotated': 'Rotated the operator’s signing key (the old key retired, still verifying what it signed)',
  'operator.created': 'Set up the operator',
  'operator.settings-updated': 'Changed the operator’s settings',
};

/** Actions whose name begins with another word than their record's type. */
const ENTITY_OF_PREFIX: Readonly<Record<string, string>> = { invitation: 'user', card: 'card-issue' };

/** The record an action belongs to is named before its first dot. */
export function entityTypeOfAction(action: string): string {
  const prefix = action.slice(0, action.indexOf('.'));
  return ENTITY_OF_PREFIX[prefix] ?? prefix;
}

export function actionLabel(action: string): string {
  return AUDIT_ACTION_LABELS[action] ?? action;
}

export function entityLabel(entityType: string): string {
  return AUDIT_ENTITY_LABELS[entityType] ?? entityType;
}
