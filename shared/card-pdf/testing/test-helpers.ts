/** Walking a pdfmake document definition in tests: every string it would print, and its tables. */
import type { Content, TDocumentDefinitions } from 'pdfmake/interfaces';

/** Header and footer as they come out for page `page` of `pages`. */
export function furnitureOf(definition: TDocumentDefinitions, page = 1, pages = 2): unknown[] {
  const call = (part: unknown) => (typeof part === 'function' ? (part as (...args: unknown[]) => unknown)(page, pages, { width: 0, height: 0 }) : part);
  return [call(definition.header), call(definition.footer)];
}

/** Every `text` string (flattened from inline runs) and every SVG string, in order. */
export function textsOf(node: unknown, out: string[] = []): string[] {
  if (typeof node === 'string') {
    out.push(node);
    return out;
  }
  if (Array.isArray(node)) {
    for (const item of node) textsOf(item, out);
    return out;
  }
  if (node && typeof node === 'object') {
    const record = node as Record<string, unknown>;
    if ('text' in record) textsOf(record['text'], out);
    if (typeof record['svg'] === 'string') out.push(record['svg'] as string);
    for (const key of ['stack', 'columns', 'content', 'ul', 'ol']) if (key in record) textsOf(record[key], out);
    if (record['table'] && typeof record['table'] === 'object') textsOf((record['table'] as { body: unknown }).body, out);
  }
  return out;
}

/** All printed words of a node as one string (inline runs joined). */
export function plainText(node: unknown): string {
  if (typeof node === 'string') return node;
  if (Array.isArray(node)) return node.map(plainText).join('');
  if (node && typeof node === 'object' && 'text' in (node as object)) return plainText((node as { text: unknown }).text);
  return '';
}

export interface FoundTable {
  readonly body: unknown[][];
}

/** Every table in the content, depth first. */
export function tablesOf(node: unknown, out: FoundTable[] = []): FoundTable[] {
  if (Array.isArray(node)) {
    for (const item of node) tablesOf(item, out);
  } else if (node && typeof node === 'object') {
    const record = node as Record<string, unknown>;
    const table = record['table'] as { body?: unknown[][] } | undefined;
    if (table?.body) {
      out.push({ body: table.body });
      tablesOf(table.body, out);
    }
    for (const key of ['stack', 'columns', 'content']) if (key in record) tablesOf(record[key], out);
  }
  return out;
}

/** The words of every table row whose first cell is a revision bar (filled black). */
export function markedRows(content: Content): string[] {
  return tablesOf(content)
    .flatMap((table) => table.body)
    .filter((row) => Array.isArray(row) && (row[0] as { fillColor?: string } | undefined)?.fillColor === '#000000')
    .map((row) => row.slice(1).map(plainText).join(' ').trim());
}
