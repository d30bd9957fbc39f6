/**
 * Every audit action the server can record has plain words on the audit-trail screen
 * (src/app/audit/audit-vocabulary.ts), so an inspector never reads a raw action name. The
 * actions are read from the server's own source: every quoted `<record>.<verb>` string naming one
 * of the screen's record types (and the two prefixes it maps, invitation and card).
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { AUDIT_ACTION_LABELS, AUDIT_ENTITY_LABELS } from '../../src/app/audit/audit-vocabulary';

function sourceFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) return entry.name === 'dev' ? [] : sourceFiles(path);
    return entry.name.endsWith('.ts') && !entry.name.endsWith('.spec.ts') ? [path] : [];
  });
}

it('has words for every action the server records', () => {
  const prefixes = [...Object.keys(AUDIT_ENTITY_LABELS), 'invitation', 'card'].join('|');
  const actionPattern = new RegExp(`'((?:${prefixes})\\.[a-z-]+)'`, 'g');
  const actions = new Set<string>();
  for (const file of sourceFiles(join(__dirname, '..'))) {
    for (const match of readFileSync(file, 'utf8').matchAll(actionPattern)) actions.add(match[1]!);
  }
  expect(actions.size).toBeGreaterThan(20);
  expect([...actions].filter((action) => !(action in AUDIT_ACTION_LABELS)).sort()).toEqual([]);
});
