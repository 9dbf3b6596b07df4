// The press room's contact form: the question is stored, and each editor gets it by e-mail with the
// reporter as Reply-To, in one transaction with the jobs that deliver them.
import { pressEnquiryMessage } from "#core/languages/mail";
import { activePeopleWithRole, type Person } from "#db/people";
import { insertEnquiry } from "#db/press";
import { queueMail, type MailContext } from "./mail";

export async function askEditors(ctx: MailContext, reporter: Person, enquiry: { subject: string; body: string; briefSlug: string | null }): Promise<void> {
  const editors = await activePeopleWithRole(ctx.db, "editor");
  await ctx.db.transaction(async (tx) => {
    await insertEnquiry(tx, { personId: reporter.id, ...enquiry });
    await queueMail(tx, ctx.queue, editors.map((editor) => pressEnquiryMessage(editor, { name: reporter.displayName, email: reporter.email, ...enquiry }, `${ctx.siteUrl}/desk`)));
  });
}
