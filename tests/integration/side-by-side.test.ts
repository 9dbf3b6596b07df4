// The reader's side-by-side against the production build: the options in the order chosen, each
// against the reference, every pair among them linked to its comparison; the form's address
// redirected to the one canonical address; anything else 404; cached like a version's page.
import { describe, expect, it } from "vitest";
import { slugify } from "#core/publication/slug";
import { demoBriefs } from "#workflows/demo-briefs";
import { withProductionServer } from "../support/production-server";

const { server } = withProductionServer();
const small = slugify(demoBriefs()[0]!.title);
const base = `/briefs/${small}/v/1/side-by-side`;
const get = (path: string) => fetch(`${server.url}${path}`, { redirect: "manual" });

describe("the side-by-side page", () => {
  it("shows the chosen options in the reader's order, against the reference, and every pair between them", async () => {
    const answer = await get(`${base}?options=nap_plan,light,drug_k`);
    expect(answer.status).toBe(200);
    const html = await answer.text();
    expect(html).toContain("Side by side: Planned-nap schedule, Timed bright-light sessions, and Sleep aid K (fictional)");
    // In the order chosen, never by a score.
    const rows = [...html.matchAll(/<th scope="row" class="py-2 pe-3 text-start font-semibold">([^<]+)<\/th>/g)].map((m) => m[1]);
    expect(rows.slice(0, 3)).toEqual(["Planned-nap schedule", "Timed bright-light sessions", "Sleep aid K (fictional)"]);
    // Three pairs in each of the two outcomes, each linked to its comparison page.
    expect(html.match(/data-testid="side-by-side-pair"/g)).toHaveLength(6);
    expect(html).toContain(`href="/briefs/${small}/v/1/compare/nap_plan/light"`);
    expect(html).toContain(`href="/briefs/${small}/v/1/compare/light/drug_k"`);
    expect(html).toContain("grouped by what the evidence supports, not ranked");
    expect(html).toContain("It is not medical advice");
    expect(answer.headers.get("cache-control")).toBe("public, max-age=3600");
    expect(answer.headers.get("surrogate-key")).toBe(`brief:${small} brief:${small}:v1`);
  });

  it("says which option is the reference of an outcome", async () => {
    const html = await (await get(`${base}?options=light,usual_care`)).text();
    expect(html).toContain("The reference of this outcome");
  });

  it("takes the form's choice to its one address, in the order chosen", async () => {
    const form = await get(`${base}?option=light&option=nap_plan`);
    expect(form.status).toBe(301);
    expect(form.headers.get("location")).toBe(`${base}?options=light,nap_plan`);
    const spanish = await get(`/es${base}?option=drug_m&option=combined`);
    expect(spanish.headers.get("location")).toBe(`/es${base}?options=drug_m,combined`);
  });

  it("answers 404 for fewer than two, more than four, repeated or unknown options", async () => {
    for (const query of ["options=light", "options=light,light", "options=light,nobody", "options=light,nap_plan,drug_k,drug_m,combined", "option=light", ""]) {
      expect((await get(`${base}?${query}`)).status, query).toBe(404);
    }
    expect((await get(`/briefs/${small}/v/9/side-by-side?options=light,nap_plan`)).status).toBe(404);
  });

  it("is offered on the brief page by a plain form that works without JavaScript", async () => {
    const html = await (await get(`/briefs/${small}`)).text();
    expect(html).toMatch(new RegExp(`<form [^>]*action="${base}" method="get">`));
    expect(html.match(/<input type="checkbox"[^>]* name="option" value="[^"]+"/g)).toHaveLength(6);
  });
});
