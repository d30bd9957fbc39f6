/**
 * Roles and what each may do. One table used by the server's role guard and by the
 * client's navigation, so the two can never disagree.
 */
export const ROLES = ['pilot', 'engineer', 'approver', 'admin', 'inspector'] as const;
export type Role = (typeof ROLES)[number];

/** Things a signed-in person may do; routes and navigation entries name one each. */
export const CAPABILITIES = [
  'read-published',
  'prepare-cards',
  'check-cards',
  'edit-speed-books',
  'publish-revisions',
  'manage-people',
  'manage-fleet',
  'read-audit',
  'read-card-log',
  /** Print speed cards in batches from the server (`POST /api/airframes/:id/card.pdf`; a GET prints an issued one again). */
  'print-card-batches',
] as const;
export type Capability = (typeof CAPABILITIES)[number];

const PILOT: readonly Capability[] = ['read-published', 'prepare-cards', 'check-cards'];
const ENGINEER: readonly Capability[] = [...PILOT, 'edit-speed-books', 'read-card-log', 'print-card-batches'];
const APPROVER: readonly Capability[] = [...ENGINEER, 'publish-revisions', 'read-audit'];

const GRANTS: Readonly<Record<Role, readonly Capability[]>> = {
  pilot: PILOT,
  engineer: ENGINEER,
  approver: APPROVER,
  admin: ['read-published', 'check-cards', 'manage-people', 'manage-fleet', 'read-audit', 'read-card-log'],
  inspector: ['read-published', 'check-cards', 'read-audit', 'read-card-log'],
};

/** Whether `role` may do `capability`. */
export function can(role: Role, capability: Capability): boolean {
  return GRANTS[role].includes(capability);
}

/** A sentence per role for the home page and the people list. */
export const ROLE_SUMMARIES: Readonly<Record<Role, string>> = {
  pilot: 'Reads the published speed data of your operator, prepares and issues speed cards, checks cards.',
  engineer: 'Everything a pilot may, and writes speed books and draft revisions from the flight manual.',
  approver: 'Everything an engineer may, and reviews, publishes or withdraws revisions written by others.',
  admin: 'Runs the operator: people and their roles, aircraft types, airframes and policies.',
  inspector: 'Reads published data, revision history, the audit trail and the card log; changes nothing.',
};

export const ROLE_LABELS: Readonly<Record<Role, string>> = {
  pilot: 'Pilot',
  engineer: 'Fleet engineer',
  approver: 'Approver',
  admin: 'Administrator',
  inspector: 'Inspector',
};
