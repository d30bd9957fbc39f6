import * as z from 'zod';
import { changeSchema } from './change-schema';

describe('changeSchema', () => {
  const schema = changeSchema({ name: z.string().min(1, 'Give the name.'), engines: z.number().int() });

  it('takes any one field, checked as on create', () => {
    expect(schema.parse({ engines: 2 })).toEqual({ engines: 2 });
    expect(schema.safeParse({ name: '' }).error?.issues[0]?.message).toBe('Give the name.');
  });

  it('refuses an empty change and an unknown field', () => {
    expect(schema.safeParse({}).error?.issues[0]?.message).toBe('Change at least one field.');
    expect(schema.safeParse({ colour: 'red' }).success).toBe(false);
  });
});
