// Citation files from a brief's fields (server/web/public/citations.ts): a field cannot break out of
// its line, whichever field it is (round 3 of the hostile probe, F6: RIS injection through the author).
import { describe, expect, it } from "vitest";
import { citationFile } from "#web/public/citations";

const input = {
  title: "Sleeping well",
  author: "G\r\nTY  - INJ",
  version: 1,
  releaseAt: "2026-12-04T09:00:00.000Z",
  url: "https://fairweigh.example/briefs/sleeping-well/v/1",
  accessed: new Date("2026-12-04T10:00:00Z"),
};

describe("citation files", () => {
  it("keep an author with a line break on one line: no new RIS record, no new BibTeX field", () => {
    const ris = citationFile(input, "ris");
    expect(ris.match(/^TY {2}- /gm)).toHaveLength(1);
    expect(ris).toMatch(/^AU {2}- G TY {2}- INJ$/m);
    expect(citationFile(input, "bib")).not.toMatch(/\n\s*TY/);
  });

  it("drop control characters from the title", () => {
    expect(citationFile({ ...input, title: "A\u0001B\u000bC" }, "ris")).toMatch(/^TI {2}- A B C$/m);
  });

  it("date a version as reference managers read dates: RIS YYYY/MM/DD/, BibTeX's month macro and the whole date", () => {
    const early = { ...input, author: "Sleep Evidence Group", releaseAt: "2026-03-05T09:00:00.000Z", accessed: new Date("2026-04-01T10:00:00Z") };
    const ris = citationFile(early, "ris");
    expect(ris).toMatch(/^DA {2}- 2026\/03\/05\/$/m);
    expect(ris).toMatch(/^Y2 {2}- 2026\/04\/01\/$/m);
    const bib = citationFile(early, "bib");
    expect(bib).toMatch(/^\tmonth = mar,$/m);
    expect(bib).toMatch(/^\tdate = \{2026-03-05\},$/m);
    expect(bib).toMatch(/^\tyear = \{2026\},$/m);
  });
});
