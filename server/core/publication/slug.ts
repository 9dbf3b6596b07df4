// The address of a brief or a topic: readable words from its title (PRODUCT.md: every brief at a stable URL).

/** Lower-case words joined by hyphens, from the title; a number is added when the slug is taken. */
export function slugify(title: string): string {
  const slug = title
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 60)
    .replace(/-+$/, "");
  return slug || "brief";
}
