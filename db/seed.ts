/**
 * The demo seed. Everything in it is invented for demonstration — not for flight.
 * Running it again changes nothing that is already there (upserts by natural key), except
 * that the demo password is set to DEMO_PASSWORD again.
 */
import type { Sequelize } from 'sequelize';
import type { Role } from '../shared/auth/roles';
import { hashPassword } from '../server/auth/passwords';
import { Operator, User } from '../server/models';

export const DEFAULT_DEMO_PASSWORD = 'speedwright-demo';

interface SeedPerson {
  email: string;
  displayName: string;
  role: Role;
}

interface SeedOperator {
  slug: string;
  name: string;
  people: SeedPerson[];
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
  },
  {
    slug: 'second-demo',
    name: 'Larkspur Air Taxi (second demo operator)',
    people: [
      { email: 'pilot@second.speedwright.example', displayName: 'Mara Quell', role: 'pilot' },
      { email: 'admin@second.speedwright.example', displayName: 'Oskar Fenwick', role: 'admin' },
    ],
  },
];

export async function seedDemo(sequelize: Sequelize, password: string): Promise<void> {
  const passwordHash = await hashPassword(password);
  await sequelize.transaction(async (transaction) => {
    for (const seedOperator of DEMO_OPERATORS) {
      const [operator] = await Operator.findOrCreate({
        where: { slug: seedOperator.slug },
        defaults: { slug: seedOperator.slug, name: seedOperator.name, isDemo: true },
        transaction,
      });
      for (const person of seedOperator.people) {
        const [user, created] = await User.findOrCreate({
          where: { email: person.email },
          defaults: { ...person, operatorId: operator.id, passwordHash, lockedUntil: null, lastSignInAt: null },
          transaction,
        });
        if (!created) await user.update({ passwordHash, failedSignIns: 0, lockedUntil: null }, { transaction });
      }
    }
  });
}
