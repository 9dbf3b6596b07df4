// Alerts around a release: the press hears of a version when it is scheduled (embargoed) and again
// when it becomes public; translators of a locale hear when a version is released; a topic's
// subscribers hear of a new or corrected brief. A job of the queue
// waits for the release time (a moved release time re-queues it), and each release is announced once
// (`release_announcements`), whichever job gets there first. The messages go through the mail queue.
import { pressAlertMessage, releaseAlertMessage, translationRequestMessage, type Message } from "#core/mail";
import { versionUrl } from "#core/urls";
import { insertMessage } from "#db/messages";
import { activePeopleWithRole } from "#db/people";
import { claimAnnouncement, versionForAnnouncement } from "#db/versions";
import { deliver, type MailContext } from "./mail";
import { slugify } from "#core/slug";
import type { Person } from "#db/people";
import { noticesFor } from "./subscriptions";

const releaseJob = "release";

/** The press who want alerts on this version's topic (a reporter who chose no topic wants them all). */
async function pressFor(ctx: MailContext, version: Version): Promise<Person[]> {
  const topic = slugify(version.topic);
  return (await activePeopleWithRole(ctx.db, "press")).filter((person) => person.alertTopics.length === 0 || person.alertTopics.includes(topic));
}
type Version = NonNullable<Awaited<ReturnType<typeof versionForAnnouncement>>>;

async function send(ctx: MailContext, messages: Message[]): Promise<void> {
  if (messages.length === 0) return;
  const ids = await ctx.db.transaction(async (tx) => Promise.all(messages.map((message) => insertMessage(tx, message))));
  await deliver(ctx.queue, ids);
}

/** After a version is published or scheduled (or its release time moved): alert now, or wait for the release. */
export async function afterPublish(ctx: MailContext, briefId: string, number: number, { rescheduled = false } = {}): Promise<void> {
  const version = await versionForAnnouncement(ctx.db, briefId, number);
  if (!version) return;
  if (version.releaseAt.getTime() > Date.now()) {
    if (!rescheduled) {
      await send(ctx, (await pressFor(ctx, version)).map((person) => pressAlertMessage(person, version, `${ctx.siteUrl}/desk/press`)));
    }
    await ctx.queue?.send(releaseJob, { briefId, number }, undefined, version.releaseAt);
    return;
  }
  await announce(ctx, version);
}

/** The release alert to the press and the translation requests, once per version. */
async function announce(ctx: MailContext, version: Version): Promise<void> {
  if (!(await claimAnnouncement(ctx.db, version.versionId))) return;
  const link = ctx.siteUrl + versionUrl({ slug: version.slug, version: version.number });
  const press = await pressFor(ctx, version);
  const translators = (await activePeopleWithRole(ctx.db, "translator")).filter((person) => person.translationLocales.length > 0);
  await send(ctx, [
    ...press.map((person) => releaseAlertMessage(person, version, link)),
    ...translators.map((person) => translationRequestMessage(person, version, `${ctx.siteUrl}/desk/translations`)),
    ...(await noticesFor(ctx, version)),
  ]);
}

/** The queue's side: at the release time, announce; if the time was moved later, wait again. */
export async function startReleaseWorker(ctx: MailContext & { queue: NonNullable<MailContext["queue"]> }): Promise<void> {
  await ctx.queue.work<{ briefId: string; number: number }>(releaseJob, async ({ data }) => {
    const version = await versionForAnnouncement(ctx.db, data.briefId, data.number);
    if (!version) return;
    if (version.releaseAt.getTime() > Date.now()) return ctx.queue.send(releaseJob, data, undefined, version.releaseAt);
    await announce(ctx, version);
  });
}
