import { diff3Merge } from "node-diff3";

/** Words and line breaks; runs of spaces count as one. */
function tokens(s: string): string[] {
  return s.split(/(\n)/).flatMap((part) => (part === "\n" ? ["\n"] : part.split(/[^\S\n]+/).filter(Boolean)));
}

function join(ts: string[]): string {
  let out = "";
  for (const t of ts) out += t === "\n" ? "\n" : out && !out.endsWith("\n") ? ` ${t}` : t;
  return out;
}

/**
 * A proposed text when someone else saved a segment while you were writing:
 * a three-way merge of your words and theirs against the version you both
 * started from (node-diff3, word by word, line breaks kept). Where you both
 * changed the same stretch, even alike, both whole versions are kept, theirs
 * first, so each still reads as its writer wrote it and no words are lost;
 * the writer edits the proposal before saving.
 */
export function proposeMerge(base: string, mine: string, theirs: string): { text: string; conflicts: number } {
  if (mine === theirs) return { text: mine, conflicts: 0 };
  if (mine === base) return { text: theirs, conflicts: 0 };
  if (theirs === base) return { text: mine, conflicts: 0 };
  let conflicts = 0;
  const out: string[] = [];
  for (const region of diff3Merge(tokens(mine), tokens(base), tokens(theirs), { excludeFalseConflicts: false })) {
    if (region.ok) out.push(...region.ok);
    else if (region.conflict) {
      conflicts += 1;
      out.push(...region.conflict.b, ...region.conflict.a);
    }
  }
  return { text: join(out), conflicts };
}
