/** The printed card's file name: `<registration>-rev<N>-<yyyy-mm-dd>.pdf`, safe on every file system. */
export function cardPdfFileName(registration: string, revisionNumber: number, dateIso: string): string {
  const date = new Date(dateIso);
  const day = Number.isNaN(date.getTime()) ? 'undated' : date.toISOString().slice(0, 10);
  // Letters and digits only, runs of anything else as one hyphen (no path separators, no dots, no spaces).
  const safe = registration
    .normalize('NFKD')
    .replace(/[^A-Za-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .toUpperCase()
    .slice(0, 40);
  const revision = Number.isInteger(revisionNumber) && revisionNumber > 0 ? String(revisionNumber) : '0';
  return `${safe || 'card'}-rev${revision}-${day}.pdf`;
}
