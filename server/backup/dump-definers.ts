/**
 * Drops the DEFINER clauses from a mariadb-dump stream, so a backup restores under whichever
 * account runs the restore. Kept, a trigger's definer (`speedwright`@`127.0.0.1` on the machine
 * that made the backup) must exist on the new server, or every insert into its table fails
 * ("The user specified as a definer does not exist"), and only an account with SUPER may create
 * objects for another definer. Without the clause MariaDB makes the current account the definer
 * (MariaDB Knowledge Base, CREATE TRIGGER / CREATE VIEW / CREATE PROCEDURE: "DEFINER").
 *
 * Only the lines mariadb-dump writes for object definitions are touched, recognised by how they
 * start; row data (lines starting `INSERT INTO` or `(`, strings with their line breaks escaped as
 * `\n`) passes unchanged, whatever text a user typed into it.
 */
import { Transform, type TransformCallback } from 'node:stream';

/** An account name as mariadb-dump quotes it: `user`@`host`, a backtick inside doubled. */
const ACCOUNT = '`(?:[^`]|``)*`@`(?:[^`]|``)*`';

const DEFINITION_LINES: [RegExp, string][] = [
  // Triggers and events: /*!50003 CREATE*/ /*!50017 DEFINER=`u`@`h`*/ /*!50003 TRIGGER …
  [new RegExp(`^(/\\*!\\d+ CREATE\\*/ )/\\*!\\d+ DEFINER=${ACCOUNT}\\s*\\*/ `), '$1'],
  // Views: /*!50013 DEFINER=`u`@`h` SQL SECURITY DEFINER */
  [new RegExp(`^(/\\*!\\d+ )DEFINER=${ACCOUNT} `), '$1'],
  // Procedures and functions: CREATE DEFINER=`u`@`h` PROCEDURE …
  [new RegExp(`^CREATE DEFINER=${ACCOUNT} `), 'CREATE '],
];

/** `line` (without its line break) with a definition's DEFINER clause removed. */
export function withoutDefiner(line: string): string {
  for (const [pattern, replacement] of DEFINITION_LINES) {
    if (pattern.test(line)) return line.replace(pattern, replacement);
  }
  return line;
}

/** Lines that can hold a definition start with one of these (ASCII, so bytes can be compared). */
const DEFINITION_STARTS = [Buffer.from('/*!'), Buffer.from('CREATE ')];
const NEWLINE = Buffer.from('\n');

function strippedLine(line: Buffer): Buffer {
  if (!DEFINITION_STARTS.some((start) => line.subarray(0, start.length).equals(start))) return line;
  const text = line.toString('utf8');
  const stripped = withoutDefiner(text);
  return stripped === text ? line : Buffer.from(stripped, 'utf8');
}

/**
 * A stream that passes a dump through line by line, without definers. It works on bytes and
 * decodes only the lines that may be definitions, so every other byte (row data above all) comes
 * out exactly as it went in. Memory is bounded by the longest line, which mariadb-dump keeps
 * near its `net_buffer_length` (1 MiB) unless one row is larger.
 */
export class DefinerStripper extends Transform {
  private pending: Buffer[] = [];

  override _transform(chunk: Buffer, _encoding: BufferEncoding, done: TransformCallback): void {
    const out: Buffer[] = [];
    let start = 0;
    for (let end = chunk.indexOf(0x0a); end >= 0; end = chunk.indexOf(0x0a, start)) {
      const line = this.pending.length ? Buffer.concat([...this.pending, chunk.subarray(start, end)]) : chunk.subarray(start, end);
      this.pending = [];
      out.push(strippedLine(line), NEWLINE);
      start = end + 1;
    }
    if (start < chunk.length) this.pending.push(chunk.subarray(start));
    done(null, out.length ? Buffer.concat(out) : undefined);
  }

  override _flush(done: TransformCallback): void {
    done(null, this.pending.length ? strippedLine(Buffer.concat(this.pending)) : undefined);
  }
}
