/**
 * A starting point for merging two versions of a segment's text: when one
 * contains the other, the longer one; otherwise both, theirs first, so no
 * words are lost. The writer edits the result before saving.
 */
export function proposeMerge(mine: string, theirs: string): string {
  const a = mine.trim();
  const b = theirs.trim();
  if (!a) return theirs;
  if (!b || b === a) return mine;
  if (b.includes(a)) return theirs;
  if (a.includes(b)) return mine;
  return `${b}\n${a}`;
}
