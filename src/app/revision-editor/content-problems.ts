import { revisionContentShape } from '@shared/speed-book/content-shape';
import { revisionContentProblems } from '@shared/speed-book/revision-content';

/**
 * The schema's problems of `content`. The cross-field rules can throw on a table emptied while
 * editing (they expect the two points the shape asks for); the shape's own sentences then say
 * what is missing.
 */
export function contentProblems(content: Record<string, unknown>): Record<string, string> {
  try {
    return revisionContentProblems(content);
  } catch {
    const result = revisionContentShape.safeParse(content);
    const fields: Record<string, string> = {};
    for (const issue of result.error?.issues ?? []) fields[issue.path.map(String).join('.') || '(content)'] ??= issue.message;
    return fields;
  }
}
