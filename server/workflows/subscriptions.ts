// Readers' topic alerts: a request queues a job (so the answer reveals nothing about who subscribed),
// the job sends a confirmation link unless the address is already subscribed; releases in the topic
// are announced to confirmed subscribers (server/workflows/alerts.ts calls `noticesFor`).
import { localeOf, localePath } from "#core/languages/locales";
import { slugify } from "#core/publication/slug";
import { subscriptionConfirmMessage, topicNoticeMessage, type Message } from "#core/languages/mail";
import { confirmSubscriptionUrl, oneClickUnsubscribeUrl, versionUrl } from "#core/publication/urls";
import { requestSubscription, subscribersOf } from "#db/subscriptions";
import { queueMail, type MailContext } from "./mail";
import type { Queue } from "./queue";
import type { Executor } from "#db/client";
import type { VersionChanges } from "#core/snapshot/changes";

const subscribeJob = "subscribe";

export async function askToSubscribe(ctx: MailContext, request: { email: string; topic: string; locale: string }): Promise<void> {
  if (ctx.queue) await ctx.queue.send(subscribeJob, request);
  else await sendConfirmation(ctx, request);
}

async function sendConfirmation(ctx: MailContext, { email, topic, locale }: { email: string; topic: string; locale: string }): Promise<void> {
  const started = await requestSubscription(ctx.db, email, slugify(topic), locale);
  if (!started) return;
  const message = subscriptionConfirmMessage({ recipient: email, topic, link: ctx.siteUrl + localePath(localeOf(locale), confirmSubscriptionUrl(started.token)), expires: started.confirmBy, locale });
  await ctx.db.transaction((tx) => queueMail(tx, ctx.queue, [message]));
}

export async function startSubscriptionWorker(ctx: MailContext & { queue: Queue }): Promise<void> {
  await ctx.queue.work<{ email: string; topic: string; locale: string }>(subscribeJob, ({ data }) => sendConfirmation(ctx, data));
}

/** The notices of a release to its topic's subscribers, each with its own unsubscribe link. */
export async function noticesFor(ctx: Pick<MailContext, "siteUrl">, tx: Executor, version: { slug: string; title: string; topic: string; number: number; note: string | null; changes: VersionChanges | null }): Promise<Message[]> {
  // Each subscriber's link opens the version in the language they subscribed in.
  const link = (locale: string) => ctx.siteUrl + localePath(localeOf(locale), versionUrl({ slug: version.slug, version: version.number }));
  const subscribers = await subscribersOf(tx, slugify(version.topic));
  return subscribers.map((subscriber) =>
    topicNoticeMessage({ recipient: subscriber.email, topic: version.topic, title: version.title, version: version.number, note: version.note, changes: version.changes, link: link(subscriber.locale), unsubscribeUrl: ctx.siteUrl + oneClickUnsubscribeUrl(subscriber.unsubscribeToken), locale: subscriber.locale }),
  );
}
