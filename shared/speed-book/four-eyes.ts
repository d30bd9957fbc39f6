/**
 * The four-eyes rule of publishing speed data: whoever contributed to a revision — started it,
 * changed its content or change summary, added or removed its source pages, or submitted it —
 * never approves it; a second person must (the segregation of duties that ASVS 1.1 and operators'
 * quality systems ask of safety data; common practice). The server enforces it and the review
 * page explains it, both in these words.
 */
export const CONTRIBUTION_KINDS = ['created', 'edited', 'attachments', 'submitted'] as const;
export type ContributionKind = (typeof CONTRIBUTION_KINDS)[number];

const WORDS: Record<ContributionKind, string> = {
  created: 'started it',
  edited: 'changed it',
  attachments: 'added or removed its source pages',
  submitted: 'submitted it',
};

/** "started it, changed it and submitted it", in the order of the revision's life. */
export function contributionWords(kinds: readonly ContributionKind[]): string {
  const words = CONTRIBUTION_KINDS.filter((kind) => kinds.includes(kind)).map((kind) => WORDS[kind]);
  if (words.length <= 1) return words[0] ?? '';
  return `${words.slice(0, -1).join(', ')} and ${words.at(-1)}`;
}

/**
 * Why this person may not approve revision `number`, or null when they may (they contributed
 * nothing). The same sentence on the review page and in the server's 403.
 */
export function fourEyesRefusal(number: number, kinds: readonly ContributionKind[]): string | null {
  if (kinds.length === 0) return null;
  return `You ${contributionWords(kinds)}, so you may not approve revision ${number}: nobody approves a revision they contributed to. Another approver must publish it.`;
}
