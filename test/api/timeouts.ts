// API tests hash passwords with argon2id and talk to a real MariaDB; on a busy 2-core machine
// a test can pass 5 s (jest's default) without anything being wrong.
jest.setTimeout(30_000);
