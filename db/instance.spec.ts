/**
 * Issue 12, finding 12: the private MariaDB lets root in on its socket only (with the generated
 * password), and the product connects as its own user with its own generated password.
 */
import { statSync } from 'node:fs';
import { join } from 'node:path';
import * as mariadb from 'mariadb';
import { localSecrets, openLocalDatabase, INSTANCE_PORTS } from './local';
import { projectRoot } from './instance';

jest.setTimeout(60_000);

const tcp = (user: string, password?: string) =>
  mariadb.createConnection({ host: '127.0.0.1', port: INSTANCE_PORTS.test, user, ...(password === undefined ? {} : { password }), connectTimeout: 5000 });

describe('the private instance’s accounts', () => {
  let url: URL;
  beforeAll(async () => {
    url = new URL((await openLocalDatabase('test', 'speedwright_accounts_check', { fresh: true })).url);
  });

  it('refuses root over TCP, with or without its password', async () => {
    await expect(tcp('root')).rejects.toMatchObject({ errno: 1045 });
    await expect(tcp('root', localSecrets().rootPassword)).rejects.toMatchObject({ errno: 1045 });
  });

  it('connects the product as its own user with the generated password, and only to its databases', async () => {
    expect(url.username).toBe('speedwright');
    expect(decodeURIComponent(url.password)).toBe(localSecrets().dbPassword);
    expect(localSecrets().dbPassword.length).toBeGreaterThanOrEqual(24);
    await expect(tcp('speedwright')).rejects.toMatchObject({ errno: 1045 });
    const conn = await tcp('speedwright', localSecrets().dbPassword);
    try {
      await expect(conn.query('SELECT COUNT(*) FROM mysql.user')).rejects.toMatchObject({ errno: 1142 });
      await conn.query('CREATE TABLE speedwright_accounts_check.probe (id INT PRIMARY KEY)');
      await conn.query('DROP TABLE speedwright_accounts_check.probe');
    } finally {
      await conn.end();
    }
  });

  it('keeps the passwords in a file only its owner reads', () => {
    expect(statSync(join(projectRoot, '.data', 'local-secrets.json')).mode & 0o077).toBe(0);
  });
});
