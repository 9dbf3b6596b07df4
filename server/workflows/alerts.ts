// Alerts around a release: the press hears of a version when it is scheduled (embargoed) and again
// when it becomes public; translators hear of a version as soon as it exists (scheduled or
// released), with what waits for them in each of their languages (docs/brief-lifecycle.md); a topic's
// subscribers hear of a new or corrected brief. Everything a publish asks for is written in the
// publishing transaction (decision 0036): the messages with their delivery jobs, and for a scheduled
// version the job that waits for its release time (a moved release time adds another). Each release
// is announced once (`release_announcements`), in the same transaction as its messages.
import { pressAlertMessage, releaseAlertMessage, translationRequestMessage } from "#core/languages/mail";
import { slugify } from "#core/publication/slug";
import { versionUrl } from "#core/publication/urls";
import type { TranslationLocale } from "#core/languages/locales";
import type { Executor } from "#db/client";
import { activePeopleWithRole, type Person } from "#db/people";
import { claimAnnouncement, versionForAnnouncement } from "#db/versions";
import { queueMail, type MailContext } from "./mail";
import { requestRenderAhead } from "./render-ahead";
import { noticesFor } from "./subscriptions";

const releaseJob = "release";

/** What alerts need besides the transaction: the queue and the site's address for links. */
export type AlertContext = Pick<MailContext, "queue" | "siteUrl">;

type Version = NonNullable<Awaited<ReturnType<typeof versionForAnnouncement>>>;

/** Per language, how many fields of a correction's carried translation wait for the translator (publish.ts). */
export type CarriedCounts = Partial<Record<TranslationLocale, number>>;

/** The press who want alerts on this version's topic (a reporter who chose no topic wants them all). */
async function pressFor(tx: Executor, version: Version): Promise<Person[]> {
  const topic = slugify(version.topic);
  return (await activePeopleWithRole(tx, "press")).filter((person) => person.alertTopics.length === 0 || person.alertTopics.includes(topic));
}

/**
 * In the transaction that publishes or schedules a version (or moves its release time): alert now,
 * or queue the job that waits for the release. `rescheduled`: the press heard of the embargo already.
 */
export async function queueAlerts(ctx: AlertContext, tx: Executor, briefId: string, number: number, { rescheduled = false, carried = {} as CarriedCounts } = {}): Promise<void> {
  const version = await versionForAnnouncement(tx, briefId, number);
  if (!version) return;
  if (version.releaseAt.getTime() > Date.now()) {
    // The press may prepare; translators may translate, so that their work goes public with the release.
    if (!rescheduled) await queueMail(tx, ctx.queue, [...(await pressFor(tx, version)).map((person) => pressAlertMessage(person, version, `${ctx.siteUrl}/desk/press`)), ...(await translationRequests(ctx, tx, version, carried))]);
    await ctx.queue?.send(releaseJob, { briefId, number }, { startAfter: version.releaseAt, in: tx });
    return;
  }
  await announce(ctx, tx, version, carried);
}

/**
 * What each translator is asked: the version in their languages, or for a correction only the
 * fields that changed in a language whose translation was carried over. Nobody is asked for nothing.
 */
async function translationRequests(ctx: AlertContext, tx: Executor, version: Version, carried: CarriedCounts) {
  const translators = (await activePeopleWithRole(tx, "translator")).filter((person) => person.translationLocales.some((locale) => carried[locale as TranslationLocale] !== 0));
  return translators.map((person) => translationRequestMessage(person, version, `${ctx.siteUrl}/desk/translations`, carried));
}

/**
 * The release alert to the press and the topic notices, once per version; the translation requests
 * too when the version is released at once (`carried`), not when translators heard of it scheduled (null).
 */
async function announce(ctx: AlertContext, tx: Executor, version: Version, carried: CarriedCounts | null): Promise<void> {
  if (!(await claimAnnouncement(tx, version.versionId))) return;
  const link = ctx.siteUrl + versionUrl({ slug: version.slug, version: version.number });
  await queueMail(tx, ctx.queue, [
    ...(await pressFor(tx, version)).map((person) => releaseAlertMessage(person, version, link)),
    ...(carried ? await translationRequests(ctx, tx, version, carried) : []),
    ...(await noticesFor(ctx, tx, version)),
  ]);
}

/** The queue's side: at the release time, announce; if the time was moved later, wait again. */
export async function startReleaseWorker(ctx: MailContext & { queue: NonNullable<MailContext["queue"]> }): Promise<void> {
  await ctx.queue.work<{ briefId: string; number: number }>(releaseJob, ({ data }) =>
    ctx.db.transaction(async (tx) => {
      const version = await versionForAnnouncement(tx, data.briefId, data.number);
      if (!version) return;
      if (version.releaseAt.getTime() > Date.now()) return ctx.queue.send(releaseJob, data, { startAfter: version.releaseAt, in: tx });
      await announce(ctx, tx, version, null);
      // Nothing in the database changes at the release time itself: its page is rendered ahead from here.
      await requestRenderAhead(ctx.queue, version.slug);
    }),
  );
}
