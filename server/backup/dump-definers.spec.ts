/**
 * The DEFINER clauses leave a dump's definitions and nothing else changes. The line forms are
 * those mariadb-dump 10.11 writes (seen in this project's dumps, and in the MariaDB Knowledge
 * Base's mariadb-dump page for views, routines and events).
 */
import { Readable } from 'node:stream';
import { DefinerStripper, withoutDefiner } from './dump-definers';

async function strip(chunks: Buffer[]): Promise<Buffer> {
  const out: Buffer[] = [];
  for await (const chunk of Readable.from(chunks).pipe(new DefinerStripper())) out.push(chunk as Buffer);
  return Buffer.concat(out);
}

describe('withoutDefiner', () => {
  it('drops the definer of a trigger, a view, a procedure and an event, keeping the rest of the line', () => {
    expect(withoutDefiner('/*!50003 CREATE*/ /*!50017 DEFINER=`speedwright`@`127.0.0.1`*/ /*!50003 TRIGGER t BEFORE INSERT ON x FOR EACH ROW SET NEW.n = 1 */;;')).toBe(
      '/*!50003 CREATE*/ /*!50003 TRIGGER t BEFORE INSERT ON x FOR EACH ROW SET NEW.n = 1 */;;',
    );
    expect(withoutDefiner('/*!50013 DEFINER=`app`@`%` SQL SECURITY DEFINER */')).toBe('/*!50013 SQL SECURITY DEFINER */');
    expect(withoutDefiner('CREATE DEFINER=`o``dd`@`localhost` PROCEDURE `p`()')).toBe('CREATE PROCEDURE `p`()');
    expect(withoutDefiner('/*!50106 CREATE*/ /*!50117 DEFINER=`app`@`10.0.0.%`*/ /*!50106 EVENT `e` ON SCHEDULE EVERY 1 DAY')).toBe('/*!50106 CREATE*/ /*!50106 EVENT `e` ON SCHEDULE EVERY 1 DAY');
  });

  it('leaves row data alone, even text that looks like a definer', () => {
    const rows = [
      "INSERT INTO `revisions` VALUES (1,'CREATE DEFINER=`a`@`b` PROCEDURE')",
      "(2,'/*!50013 DEFINER=`a`@`b` SQL SECURITY DEFINER */'),",
      "('/*!50003 CREATE*/ /*!50017 DEFINER=`a`@`b`*/ /*!50003 TRIGGER')",
    ];
    for (const row of rows) expect(withoutDefiner(row)).toBe(row);
  });
});

describe('DefinerStripper', () => {
  it('passes every byte of the data through unchanged, wherever the chunks break (inside a UTF-8 character too)', async () => {
    const dump = Buffer.from(
      [
        '-- MariaDB dump',
        "INSERT INTO `t` VALUES (1,'Überziehwarnung — 65 kt \\n zweite Zeile ✈'),",
        "(2,'\u00e9\u00e8 DEFINER=`x`@`y`');",
        '/*!50003 CREATE*/ /*!50017 DEFINER=`speedwright`@`127.0.0.1`*/ /*!50003 TRIGGER t BEFORE INSERT ON x FOR EACH ROW SET NEW.n = 1 */;;',
        'no line break at the end',
      ].join('\n'),
      'utf8',
    );
    const expected = Buffer.from(dump.toString('utf8').replace(' /*!50017 DEFINER=`speedwright`@`127.0.0.1`*/', ''), 'utf8');
    expect(await strip([dump])).toEqual(expected);
    for (let cut = 1; cut < dump.length; cut += 1) {
      expect(await strip([dump.subarray(0, cut), dump.subarray(cut)])).toEqual(expected);
    }
    // One byte at a time.
    expect(await strip([...dump].map((byte) => Buffer.from([byte])))).toEqual(expected);
  });

  it('keeps bytes that are not UTF-8 in data lines exactly', async () => {
    const latin1Row = Buffer.concat([Buffer.from("INSERT INTO `t` VALUES ('"), Buffer.from([0xe9, 0xff, 0xfe]), Buffer.from("');\n")]);
    expect(await strip([latin1Row])).toEqual(latin1Row);
  });
});
