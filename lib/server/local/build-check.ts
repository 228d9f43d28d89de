import fs from "node:fs";
import path from "node:path";

function newestMtime(dir: string): number {
  let newest = 0;
  if (!fs.existsSync(dir)) return 0;
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    if (entry.name === "node_modules" || entry.name.startsWith(".")) continue;
    const p = path.join(dir, entry.name);
    newest = Math.max(newest, entry.isDirectory() ? newestMtime(p) : fs.statSync(p).mtimeMs);
  }
  return newest;
}

/** True when any source or config is newer than the last `next build`. */
export function buildIsStale(root: string): boolean {
  const id = path.join(root, ".next", "BUILD_ID");
  if (!fs.existsSync(id)) return true;
  const built = fs.statSync(id).mtimeMs;
  const sources = ["app", "components", "lib", "db", "storage", "public"].map((d) => newestMtime(path.join(root, d)));
  const configs = ["next.config.mjs", "tailwind.config.ts", "package.json", "package-lock.json", "tsconfig.json", "postcss.config.mjs"].map((f) =>
    fs.existsSync(path.join(root, f)) ? fs.statSync(path.join(root, f)).mtimeMs : 0,
  );
  return Math.max(...sources, ...configs) > built;
}
