import { NavigationEntry } from './core/navigation/navigation-entry';

/**
 * Every place in the app, in navigation order. A new feature adds its entry here; the router,
 * the side navigation and the home page's next steps all follow from it.
 */
export const APP_NAVIGATION: readonly NavigationEntry[] = [
  {
    path: 'home',
    label: 'Home',
    icon: 'home',
    capability: null,
    purpose: 'Who you are, your operator and what your role may do.',
    title: 'Home · Speedwright',
    loadComponent: () => import('./home/home-page').then((m) => m.HomePage),
  },
  {
    path: 'speed-books',
    label: 'Speed books',
    icon: 'menu_book',
    capability: 'read-published',
    purpose: 'Read each speed book, its current revision and its revision history.',
    title: 'Speed books · Speedwright',
    loadComponent: () => import('./speed-books/speed-books-page').then((m) => m.SpeedBooksPage),
  },
  {
    path: 'drafts',
    label: 'Drafts',
    icon: 'edit_note',
    capability: 'edit-speed-books',
    purpose: 'Enter flight-manual data into draft revisions, by form or CSV upload, and submit them for review.',
    title: 'Drafts · Speedwright',
    loadComponent: () => import('./revision-editor/drafts-page').then((m) => m.DraftsPage),
  },
  {
    path: 'review',
    label: 'Review',
    icon: 'rate_review',
    capability: 'publish-revisions',
    purpose: 'Compare revisions in review with the published one and the source pages, then publish or return them.',
    title: 'Review · Speedwright',
    loadComponent: () => import('./review/review-page').then((m) => m.ReviewPage),
  },
  {
    path: 'fleet',
    label: 'Fleet',
    icon: 'flight',
    capability: 'read-published',
    purpose: "See your operator's airframes by registration and the aircraft types they belong to.",
    title: 'Fleet · Speedwright',
    loadComponent: () => import('./fleet/fleet-page').then((m) => m.FleetPage),
  },
  {
    path: 'people',
    label: 'People',
    icon: 'group',
    capability: 'manage-people',
    purpose: "Invite your operator's people, change their roles, lock and unlock accounts, and see when each last signed in.",
    title: 'People · Speedwright',
    loadComponent: () => import('./people/people-page').then((m) => m.PeoplePage),
  },
  {
    path: 'audit',
    label: 'Audit trail',
    icon: 'history',
    capability: 'read-audit',
    purpose: 'Look up who changed which record and when, filtered by record, action, person and dates.',
    title: 'Audit trail · Speedwright',
    loadComponent: () => import('./audit/audit-page').then((m) => m.AuditPage),
  },
  {
    path: 'mailbox',
    label: 'Mailbox',
    icon: 'inbox',
    // The server answers only administrators, and only while its local fake mail server runs.
    capability: 'manage-people',
    purpose: 'Read the mails sent while Speedwright runs without a real mail server, and follow their links.',
    title: 'Mailbox · Speedwright',
    loadComponent: () => import('./mailbox/mailbox-page').then((m) => m.MailboxPage),
  },
];
