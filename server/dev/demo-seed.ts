/**
 * The demo seed. Everything in it is invented for demonstration — not for flight.
 * Running it again changes nothing that is already there (upserts by natural key), except
 * that the demo password is set to DEMO_PASSWORD again.
 */
import type { Sequelize } from 'sequelize';
import type { Role } from '@shared/auth/roles';
import type { AircraftCategory, RevisionContent } from '@shared/speed-book/revision-content';
import {
  demoLightTwinJetContent,
  demoPistonTrainerContent,
  demoPistonTrainerContentRevised,
  demoTwinTurbopropContent,
} from '@shared/speed-book/demo-content';
import type { Actor } from '../audit/actor';
import { hashPassword } from '../auth/passwords';
import { AircraftType, Airframe, Operator, Revision, SpeedBook, User } from '../models';
import { approveRevision, createRevision, submitRevision } from '../revisions/revisions.service';
import { localSecrets } from '../../db/local';

export const DEFAULT_DEMO_PASSWORD = 'speedwright-demo';

export interface SeedPerson {
  email: string;
  displayName: string;
  role: Role;
}

export interface SeedRevision {
  content: RevisionContent;
  changeSummary: string;
}

export interface SeedType {
  designator: string;
  name: string;
  category: AircraftCategory;
  engines: number;
  ceilingFt: number;
  airframes: { registration: string; serial: string; active?: boolean }[];
  /** The speed book and its revisions, oldest first; each is published by the approver. */
  speedBook?: { title: string; revisions: SeedRevision[] };
}

export interface SeedOperator {
  slug: string;
  name: string;
  people: SeedPerson[];
  fleet: SeedType[];
}

export const DEMO_OPERATORS: SeedOperator[] = [
  {
    slug: 'kestrel-fen',
    name: 'Kestrel Fen Aviation (demo)',
    people: [
      { email: 'pilot@demo.speedwright.example', displayName: 'Ines Marlow', role: 'pilot' },
      { email: 'engineer@demo.speedwright.example', displayName: 'Tobias Wren', role: 'engineer' },
      { email: 'approver@demo.speedwright.example', displayName: 'Capt. Ada Okonjo', role: 'approver' },
      { email: 'admin@demo.speedwright.example', displayName: 'Priya Halden', role: 'admin' },
      { email: 'inspector@demo.speedwright.example', displayName: 'Jonas Brightwater', role: 'inspector' },
    ],
    fleet: [
      {
        designator: 'ZZP1',
        name: 'Sedgeling 4 (invented four-seat trainer)',
        category: 'piston-single',
        engines: 1,
        ceilingFt: 14000,
        airframes: [
          { registration: 'ZZ-KFA', serial: 'SG4-0012' },
          { registration: 'ZZ-KFB', serial: 'SG4-0031' },
          { registration: 'ZZ-KFC', serial: 'SG4-0047', active: false },
        ],
        speedBook: {
          title: 'Sedgeling 4 speed book',
          revisions: [
            { content: demoPistonTrainerContent(), changeSummary: 'First issue from the flight manual (invented demo data — not for flight).' },
            { content: demoPistonTrainerContentRevised(), changeSummary: 'Corrects VR, VX, VREF and the flaps-30° VFE; adds an approach speed (invented demo data — not for flight).' },
          ],
        },
      },
      {
        designator: 'ZZT2',
        name: 'Marshlight T2 (invented twin turboprop)',
        category: 'turboprop',
        engines: 2,
        ceilingFt: 30000,
        airframes: [
          { registration: 'ZZ-KFT', serial: 'MT2-104' },
          { registration: 'ZZ-KFU', serial: 'MT2-117' },
        ],
        speedBook: {
          title: 'Marshlight T2 speed book',
          revisions: [{ content: demoTwinTurbopropContent(), changeSummary: 'First issue (invented demo data — not for flight).' }],
        },
      },
      {
        designator: 'ZZJ2',
        name: 'Heronbolt J2 (invented light twin-jet)',
        category: 'jet',
        engines: 2,
        ceilingFt: 41000,
        airframes: [{ registration: 'ZZ-KFJ', serial: 'HJ2-0009' }],
        speedBook: {
          title: 'Heronbolt J2 speed book',
          revisions: [{ content: demoLightTwinJetContent(), changeSummary: 'First issue (invented demo data — not for flight).' }],
        },
      },
    ],
  },
  {
    slug: 'second-demo',
    name: 'Larkspur Air Taxi (second demo operator)',
    people: [
      { email: 'pilot@second.speedwright.example', displayName: 'Mara Quell', role: 'pilot' },
      { email: 'admin@second.speedwright.example', displayName: 'Oskar Fenwick', role: 'admin' },
    ],
    fleet: [
      {
        designator: 'ZZP2',
        name: 'Tern Twin 6 (invented piston twin)',
        category: 'piston-twin',
        engines: 2,
        ceilingFt: 20000,
        airframes: [{ registration: 'ZZ-LAT', serial: 'TT6-221' }],
      },
    ],
  },
];

export interface SeedOptions {
  /** The server's SIGNING_KEY_SECRET: the demo revisions are signed like any other. */
  signingKeySecret?: string;
}

export async function seedDemo(sequelize: Sequelize, password: string, options: SeedOptions = {}): Promise<void> {
  await seedOperators(sequelize, DEMO_OPERATORS, password, options);
}

/**
 * Operators with their people, fleets and speed books, idempotent by natural keys. The demo
 * seed uses it with `DEMO_OPERATORS`; the benchmarks with generated operators of their own.
 */
export async function seedOperators(sequelize: Sequelize, operators: readonly SeedOperator[], password: string, options: SeedOptions = {}): Promise<void> {
  const signingKeySecret = options.signingKeySecret ?? process.env['SIGNING_KEY_SECRET'] ?? localSecrets().signingKeySecret;
  const passwordHash = await hashPassword(password);
  await sequelize.transaction(async (transaction) => {
    for (const seedOperator of operators) {
      const [operator] = await Operator.findOrCreate({
        where: { slug: seedOperator.slug },
        defaults: { slug: seedOperator.slug, name: seedOperator.name, isDemo: true },
        transaction,
      });
      for (const person of seedOperator.people) {
        // The operator's own person of that address (an invitation elsewhere may share it).
        const [user, created] = await User.findOrCreate({
          where: { email: person.email, operatorId: operator.id },
          defaults: { ...person, operatorId: operator.id, passwordHash, lockedUntil: null, lastSignInAt: null },
          transaction,
        });
        if (!created) await user.update({ passwordHash, failedSignIns: 0, lockedUntil: null }, { transaction });
      }
    }
  });
  for (const seedOperator of operators) await seedFleet(sequelize, seedOperator, signingKeySecret);
}

/** The demo operators' fleets and speed books (the people must exist already). */
export async function seedDemoFleet(sequelize: Sequelize, signingKeySecret: string): Promise<void> {
  for (const seedOperator of DEMO_OPERATORS) await seedFleet(sequelize, seedOperator, signingKeySecret);
}

/** Types, airframes and speed books by natural key; revisions only for a book that has none. */
async function seedFleet(sequelize: Sequelize, seedOperator: SeedOperator, signingKeySecret: string): Promise<void> {
  const operator = await Operator.findOne({ where: { slug: seedOperator.slug }, rejectOnEmpty: true });
  const byRole = async (role: Role): Promise<Actor | undefined> => {
    const email = seedOperator.people.find((person) => person.role === role)?.email;
    const user = email ? await User.findOne({ where: { email, operatorId: operator.id } }) : null;
    return user ? { operatorId: operator.id, userId: user.id, role, sendsMail: false } : undefined;
  };
  const engineer = await byRole('engineer');
  const approver = await byRole('approver');
  for (const seedType of seedOperator.fleet) {
    const book = await sequelize.transaction(async (transaction) => {
      const { airframes, speedBook, ...typeFields } = seedType;
      const [type] = await AircraftType.findOrCreate({
        where: { operatorId: operator.id, designator: seedType.designator },
        defaults: { ...typeFields, operatorId: operator.id },
        transaction,
      });
      for (const airframe of airframes) {
        await Airframe.findOrCreate({
          where: { operatorId: operator.id, registration: airframe.registration },
          defaults: { ...airframe, operatorId: operator.id, aircraftTypeId: type.id },
          transaction,
        });
      }
      if (!speedBook) return undefined;
      const [book] = await SpeedBook.findOrCreate({
        where: { operatorId: operator.id, aircraftTypeId: type.id },
        defaults: { operatorId: operator.id, aircraftTypeId: type.id, title: speedBook.title },
        transaction,
      });
      return book;
    });
    const revisions = seedType.speedBook?.revisions ?? [];
    if (!book || !engineer || !approver || (await Revision.count({ where: { speedBookId: book.id } })) > 0) continue;
    // Through the same service as the API: written by the engineer, published by the approver.
    for (const revision of revisions) {
      const draft = await createRevision(engineer, book.id, revision);
      await submitRevision(engineer, draft.id);
      await approveRevision(approver, draft.id, signingKeySecret);
    }
  }
}
