// Publishing: the approved draft is frozen as the brief's next version. Version 1 publishes; later
// versions correct and need a public note. A release time in the future schedules it (the embargo).
// The version, the brief's status, the audit row and the alerts with their jobs commit together
// (decision 0036): a process that dies half-way leaves all of them or none. `alerts` null: publish
// silently (the demo's seed).
import type { VersionSnapshot } from "#core/snapshot/schema";
import { versionUrl } from "#core/publication/urls";
import { lockBrief, setBriefState } from "#db/briefs";
import type { Database, Executor } from "#db/client";
import { approvalOf } from "#db/reviews";
import { insertCarriedTranslation, publishedTranslationsBefore } from "#db/translations";
import { carriedTranslation, fieldViews, sourceFields, unfinished } from "#core/languages/translation";
import { insertVersion, lastVersionNumber, moveReleaseTime, releaseTimeOf, snapshotOf } from "#db/versions";
import { versionChanges } from "#core/snapshot/changes";
import type { ReadinessItem } from "#core/editorial/readiness";
import { queueAlerts, type AlertContext, type CarriedCounts } from "./alerts";
import { briefReadiness } from "./readiness";
import { contentChecksum, draftSnapshot } from "./snapshot";

export type PublishOutcome =
  | { ok: true; version: number; url: string }
  | { ok: false; reason: "not-found" | "not-ready" | "not-approved" | "withdrawn" | "note-required"; detail: string; items?: ReadinessItem[] };

export type RescheduleOutcome = { ok: true; releaseAt: string } | { ok: false; reason: "not-found" | "released" | "past"; detail: string };

/** An embargoed version's release moves to another future time; once released, it is frozen like any other. */
export async function rescheduleRelease(db: Database, briefId: string, number: number, releaseAt: Date, actorId: string, alerts: AlertContext | null): Promise<RescheduleOutcome> {
  if (releaseAt.getTime() <= Date.now()) return { ok: false, reason: "past", detail: "the new release time must be in the future (publish now instead)" };
  return db.transaction(async (tx) => {
    const brief = await lockBrief(tx, briefId);
    const current = brief ? await releaseTimeOf(tx, briefId, number) : null;
    if (!brief || !current) return { ok: false, reason: "not-found", detail: "there is no such version" };
    if (current.getTime() <= Date.now()) return { ok: false, reason: "released", detail: "this version is released and frozen" };
    await moveReleaseTime(tx, briefId, number, releaseAt);
    await setBriefState(tx, brief, {}, { actorId, action: "reschedule", after: { version: number, from: current, releaseAt } });
    if (alerts) await queueAlerts(alerts, tx, briefId, number, { rescheduled: true });
    return { ok: true, releaseAt: releaseAt.toISOString() };
  });
}

/**
 * A correction's translations, carried field by field from the newest published translation of
 * each language (server/core/languages/translation.ts): readers of that language keep every passage
 * whose source did not change. Answers, per language, how many fields wait for the translator.
 */
async function carryTranslations(tx: Executor, briefId: string, versionId: string, snapshot: VersionSnapshot): Promise<CarriedCounts> {
  const counts: CarriedCounts = {};
  for (const earlier of await publishedTranslationsBefore(tx, briefId, snapshot.version)) {
    const carried = carriedTranslation(earlier, snapshot);
    const waiting = unfinished(fieldViews(sourceFields(snapshot), carried.fields));
    const open = new Set([...carried.open, ...waiting.empty, ...waiting.stale]).size;
    await insertCarriedTranslation(tx, { versionId, locale: earlier.locale }, { ...carried, complete: open === 0 });
    counts[earlier.locale] = open;
  }
  return counts;
}

export async function publishVersion(db: Database, briefId: string, options: { releaseAt?: Date; note?: string }, actorId: string, alerts: AlertContext | null): Promise<PublishOutcome> {
  const readiness = await briefReadiness(db, briefId);
  if (readiness && readiness.blocking.length > 0) return { ok: false, reason: "not-ready", detail: "the draft is not ready to publish", items: readiness.blocking };
  const draft = await draftSnapshot(db, briefId);
  if (!draft.ok) return draft;
  return db.transaction(async (tx) => {
    const brief = (await lockBrief(tx, briefId))!;
    if (brief.withdrawnAt) return { ok: false, reason: "withdrawn", detail: "the brief has been withdrawn" };
    const approval = await approvalOf(tx, briefId);
    if (approval !== contentChecksum(draft.snapshot)) {
      return { ok: false, reason: "not-approved", detail: approval ? "the draft has changed since it was approved; it needs a new review" : "the draft has not been approved in review" };
    }
    const number = (await lastVersionNumber(tx, briefId)) + 1;
    const note = options.note?.trim() || null;
    if (number > 1 && !note) return { ok: false, reason: "note-required", detail: "a correction needs a public note saying what changed" };
    const releaseAt = options.releaseAt ?? new Date();
    const snapshot: VersionSnapshot = { ...draft.snapshot, version: number, releaseAt: releaseAt.toISOString(), note };
    const before = number > 1 ? await snapshotOf(tx, briefId, number - 1) : null;
    const changes = before ? versionChanges(before, snapshot) : null;
    const versionId = await insertVersion(tx, { briefId, number, releaseAt, note, snapshot, changes, createdBy: actorId });
    const carried = await carryTranslations(tx, briefId, versionId, snapshot);
    const status = releaseAt.getTime() > Date.now() ? "scheduled" : number > 1 ? "corrected" : "published";
    await setBriefState(tx, brief, { status }, { actorId, action: "publish", after: { status, version: number, releaseAt } });
    if (alerts) await queueAlerts(alerts, tx, briefId, number, { carried });
    return { ok: true, version: number, url: versionUrl({ slug: brief.slug, version: number }) };
  });
}
