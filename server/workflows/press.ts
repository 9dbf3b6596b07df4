// The press room's contact form: the question is stored, and each editor gets it by e-mail with the
// reporter as Reply-To, in one transaction; delivery follows through the queue.
import { pressEnquiryMessage } from "#core/mail";
import { insertMessage } from "#db/messages";
import { activePeopleWithRole, type Person } from "#db/people";
import { insertEnquiry } from "#db/press";
import { deliver, type MailContext } from "./mail";

export async function askEditors(ctx: MailContext, reporter: Person, enquiry: { subject: string; body: string; briefSlug: string | null }): Promise<void> {
  const editors = await activePeopleWithRole(ctx.db, "editor");
  const ids = await ctx.db.transaction(async (tx) => {
    await insertEnquiry(tx, { personId: reporter.id, ...enquiry });
    return Promise.all(editors.map((editor) => insertMessage(tx, pressEnquiryMessage(editor, { name: reporter.displayName, email: reporter.email, ...enquiry }, `${ctx.siteUrl}/desk`))));
  });
  await deliver(ctx.queue, ids);
}
