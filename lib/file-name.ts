/** A safe download file-name part from a title: "Walnut side table!" → "walnut-side-table". */
export function fileSlug(title: string): string {
  return (
    title
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, "-")
      .replace(/^-|-$/g, "")
      .slice(0, 60) || "episode"
  );
}
