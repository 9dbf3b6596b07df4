// The search page shows a page of results at a time (server/core/publication/search.ts), and its addresses say
// which page (server/core/publication/urls.ts).
import { describe, expect, it } from "vitest";
import { pageOf, resultsPerPage } from "#core/publication/search";
import { searchUrl } from "#core/publication/urls";

describe("pages of results", () => {
  const items = Array.from({ length: 2 * resultsPerPage + 3 }, (_, i) => i);

  it("cuts the list into pages and clamps a page that does not exist", () => {
    expect(pageOf(items, 1)).toEqual({ items: items.slice(0, resultsPerPage), page: 1, pages: 3 });
    expect(pageOf(items, 3).items).toEqual(items.slice(2 * resultsPerPage));
    expect(pageOf(items, 99).page).toBe(3);
    expect(pageOf(items, Number("x")).page).toBe(1);
    expect(pageOf([], 1)).toEqual({ items: [], page: 1, pages: 1 });
  });

  it("names the page in the address, except the first", () => {
    expect(searchUrl({ q: "sleep", page: 1 })).toBe("/briefs?q=sleep");
    expect(searchUrl({ q: "sleep", topic: "sleep", page: 2 })).toBe("/briefs?q=sleep&topic=sleep&page=2");
    expect(searchUrl()).toBe("/briefs");
  });
});
