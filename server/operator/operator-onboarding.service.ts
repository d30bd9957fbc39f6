/**
 * Setting up a real operator (issue 14, part 2): the operator row (never demo), its Ed25519
 * signing key and its first administrator with an invitation, in one transaction and audited;
 * and the list of operators with their counts. No HTTP here: the command line
 * (server/cli/operator.ts) is the only caller, so the audit trail records the command line as
 * where the change came from, with nobody signed in.
 */
import { QueryTypes, UniqueConstraintError, fn, col, where } from 'sequelize';
import { COMMAND_LINE_USER_AGENT } from '@shared/api/audit';
import { createOperatorRequestSchema, type OperatorSummary } from '@shared/api/operators';
import type { RequestOrigin } from '../audit/actor';
import { recordAudit } from '../audit/audit.service';
import { invitationLink, issueInvitation, sendInvitation } from '../auth/invitations.service';
import { DomainError } from '../errors/domain-error';
import { fieldErrors } from '../errors/field-errors';
import { Operator, User } from '../models';
import { activeSigningKey } from '../revisions/signing';
import { database, transact } from '../transactions';

/** Where changes made with the server's command line come from, for the audit trail. */
export function commandLineOrigin(command: string): RequestOrigin {
  return { ip: null, userAgent: `${COMMAND_LINE_USER_AGENT} (${command})` };
}

export interface CreatedOperator {
  operator: { id: number; slug: string; name: string };
  admin: { id: number; email: string; displayName: string };
  signingKey: { id: number; publicKey: string };
  /** The invitation link, for a first install without mail (it works once, until `invitationExpiresAt`). */
  invitationLink: string;
  invitationExpiresAt: Date;
  /** Whether the mail server took the invitation. */
  mailSent: boolean;
}

/** Longest slug kept from the name; a suffix may follow to keep it unique (the column holds 64). */
const SLUG_STEM_LENGTH = 48;
/** Suffixes tried before a random one, so the loop is bounded whatever the names. */
const SLUG_TRIES = 50;

/** `Aero Nord Ambulance GmbH` → `aero-nord-ambulance-gmbh`; accents dropped, anything else a hyphen. */
export function slugOf(name: string): string {
  const stem = name
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, SLUG_STEM_LENGTH)
    .replace(/-+$/g, '');
  return stem || 'operator';
}

const duplicateName = (existing: string) =>
  new DomainError('conflict', 'operator_name_taken', `An operator named “${existing}” already exists; choose another name (names are compared without regard to case).`, {
    name: 'An operator of that name already exists.',
  });

const addressInUse = (email: string, operatorName: string) =>
  new DomainError('conflict', 'address_in_use', `The address ${email} already belongs to a person of “${operatorName}”, and one address signs in for one operator only; give another address for the first administrator.`, {
    adminEmail: 'This address already belongs to a person of an operator.',
  });

/**
 * Creates the operator, its signing key (the same locked creation as a first publication's,
 * `activeSigningKey`) and its first administrator without a password, and issues the
 * invitation (`issueInvitation`, as an administrator's invitation is) — all in one
 * transaction, audited as `operator.created` and `user.invited`. The invitation is mailed
 * after the commit through the configured outbox; the link is returned either way.
 *
 * Refuses (DomainError, nothing written) a name or address that breaks the shared field rules,
 * a name another operator has (case-insensitive), and an address any operator's person has.
 */
export async function createOperator(request: unknown, signingKeySecret: string, origin: RequestOrigin): Promise<CreatedOperator> {
  const parsed = createOperatorRequestSchema.safeParse(request);
  if (!parsed.success) {
    const fields = fieldErrors(parsed.error);
    throw new DomainError('invalid', 'invalid_request', Object.values(fields)[0] ?? 'The operator’s details are not right.', fields);
  }
  const { name, adminEmail } = parsed.data;
  const adminName = parsed.data.adminName ?? adminEmail.split('@')[0]!;

  let created: Omit<CreatedOperator, 'invitationLink' | 'mailSent'> & { invitation: Awaited<ReturnType<typeof issueInvitation>>; user: User };
  try {
    created = await transact(async (transaction) => {
      const sameName = await Operator.findOne({ where: where(fn('LOWER', col('name')), name.toLowerCase()), transaction });
      if (sameName) throw duplicateName(sameName.name);
      const sameAddress = await User.findOne({ where: { email: adminEmail }, include: [{ model: Operator, as: 'operator' }], transaction });
      if (sameAddress) throw addressInUse(adminEmail, sameAddress.operator?.name ?? 'another operator');

      const operator = await Operator.create({ slug: await freeSlug(slugOf(name)), name, isDemo: false }, { transaction });
      const key = await activeSigningKey(operator.id, signingKeySecret, transaction, { origin });
      const user = await User.create(
        { operatorId: operator.id, email: adminEmail, displayName: adminName, role: 'admin', passwordHash: null, lockedUntil: null, lastSignInAt: null },
        { transaction },
      );
      const invitation = await issueInvitation(user, null, transaction);
      await recordAudit(
        { operatorId: operator.id, actorId: null, action: 'operator.created', entityType: 'operator', entityId: operator.id, details: { name, slug: operator.slug, signingKeyId: key.id }, origin },
        transaction,
      );
      await recordAudit(
        { operatorId: operator.id, actorId: null, action: 'user.invited', entityType: 'user', entityId: user.id, details: { email: user.email, role: user.role }, origin },
        transaction,
      );
      return {
        operator: { id: operator.id, slug: operator.slug, name: operator.name },
        admin: { id: user.id, email: user.email, displayName: user.displayName },
        signingKey: { id: key.id, publicKey: key.publicKey },
        invitationExpiresAt: invitation.expiresAt,
        invitation,
        user,
      };
    });
  } catch (error) {
    // Two set-ups of one slug at once: the unique index decides, and the later one says so.
    if (error instanceof UniqueConstraintError) throw duplicateName(name);
    throw error;
  }
  const { invitation, user, ...result } = created;
  const mailSent = await sendInvitation(user, null, invitation);
  return { ...result, invitationLink: invitationLink(invitation), mailSent };
}

/** `stem`, or `stem-2`, `stem-3` … when another operator has it; bounded, then a random suffix. */
async function freeSlug(stem: string): Promise<string> {
  const taken = new Set(
    (await database().query<{ slug: string }>('SELECT slug FROM operators WHERE slug = ? OR slug LIKE ?', { replacements: [stem, `${stem}-%`], type: QueryTypes.SELECT })).map((row) => row.slug),
  );
  if (!taken.has(stem)) return stem;
  for (let n = 2; n <= SLUG_TRIES; n++) if (!taken.has(`${stem}-${n}`)) return `${stem}-${n}`;
  return `${stem}-${Math.random().toString(36).slice(2, 10)}`;
}

interface SummaryRow {
  id: number;
  slug: string;
  name: string;
  is_demo: number | boolean;
  people: number;
  aircraft_types: number;
  airframes: number;
  published_revisions: number;
  created_at: Date;
}

/** Every operator with its counts, oldest first: people, aircraft types, airframes, revisions in force. */
export async function listOperators(): Promise<OperatorSummary[]> {
  const rows = await database().query<SummaryRow>(
    `SELECT o.id, o.slug, o.name, o.is_demo, o.created_at,
            (SELECT COUNT(*) FROM users u WHERE u.operator_id = o.id) AS people,
            (SELECT COUNT(*) FROM aircraft_types t WHERE t.operator_id = o.id) AS aircraft_types,
            (SELECT COUNT(*) FROM airframes a WHERE a.operator_id = o.id) AS airframes,
            (SELECT COUNT(*) FROM revisions r WHERE r.operator_id = o.id AND r.status = 'published') AS published_revisions
     FROM operators o ORDER BY o.id`,
    { type: QueryTypes.SELECT },
  );
  return rows.map((row) => ({
    id: row.id,
    slug: row.slug,
    name: row.name,
    isDemo: Boolean(row.is_demo),
    people: Number(row.people),
    aircraftTypes: Number(row.aircraft_types),
    airframes: Number(row.airframes),
    publishedRevisions: Number(row.published_revisions),
    createdAt: new Date(row.created_at).toISOString(),
  }));
}
