import { Capability } from '@shared/auth/roles';

/** Each capability as a plain sentence a person reads on their home page. */
export const CAPABILITY_SENTENCES: Readonly<Record<Capability, string>> = {
  'read-published': "Read your operator's published speed books and revisions.",
  'prepare-cards': 'Prepare and issue speed cards for the weight and conditions of a flight.',
  'check-cards': 'Check whether a speed card was built from the revision that is current now.',
  'edit-speed-books': 'Write speed books and draft revisions from the flight manual, and submit them for review.',
  'publish-revisions': 'Review revisions written by others, then publish, return or withdraw them.',
  'manage-people': "Manage your operator's people: their roles and locked accounts.",
  'manage-fleet': 'Manage aircraft types, airframes and operator policies.',
  'read-audit': 'Read the revision history and the audit trail.',
  'read-card-log': 'Read the card log: which cards were issued, when and by whom.',
  'print-card-batches': 'Print speed cards from the server for an airframe, for a batch of flights.',
};
