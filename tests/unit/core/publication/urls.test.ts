// The address classes the page cache and the CSRF tokens go by (server/core/publication/urls.ts): which pages are
// lists, which carry a form, which exist in every language, and the one spelling of a version's page.
import { describe, expect, it } from "vitest";
import { holdsForm, isListPath, negotiates, parseBriefPath, parseTopicPath, parseVersionPath } from "#core/publication/urls";

describe("address classes", () => {
  it("the lists are the home page, the search and a topic's page", () => {
    expect(["/", "/briefs", "/topics/sleep"].filter(isListPath)).toEqual(["/", "/briefs", "/topics/sleep"]);
    expect(["/topics", "/topics/sleep/more", "/briefs/a-brief", "/data"].filter(isListPath)).toEqual([]);
    expect(parseTopicPath("/topics/sleep%20well")).toBe("sleep well");
  });

  it("the pages with a form are sign-in, the reset form and each one-time link's page", () => {
    expect(["/sign-in", "/password-reset", "/password-reset/abc", "/invitation/abc"].filter(holdsForm)).toHaveLength(4);
    expect(["/password-reset/", "/password-reset/abc/more", "/invitation/", "/invitations/abc", "/briefs"].filter(holdsForm)).toEqual([]);
  });

  it("every page but the desk's and a draft's preview exists in every language", () => {
    expect(["/", "/briefs/a", "/data", "/sign-in"].every(negotiates)).toBe(true);
    expect(["/desk", "/desk/briefs/1", "/preview/1"].some(negotiates)).toBe(false);
  });

  it("a version's page and a brief's latest address have one spelling each", () => {
    expect(parseVersionPath("/briefs/a-brief/v/2")).toEqual({ kind: "version", at: { slug: "a-brief", version: 2 }, canonical: true });
    expect(parseVersionPath("/briefs/a-brief/v/2/")?.canonical).toBe(false);
    expect(parseVersionPath("/briefs/a-brief/v/02")).toBeNull();
    expect(parseVersionPath("/briefs/a-brief/v/1/compare/light/usual_care")).toMatchObject({ kind: "comparison", canonical: true });
    expect(parseBriefPath("/briefs/a-brief")).toBe("a-brief");
    expect(parseBriefPath("/briefs/a-brief/v/1")).toBeNull();
  });
});
