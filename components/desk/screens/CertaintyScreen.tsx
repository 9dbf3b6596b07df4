// Certainty per comparison: what is rated, what still needs a judgement, and a form for one pair.
import { useState } from "react";
import { useTranslation } from "react-i18next";
import { useParams } from "react-router";
import { DeskLink } from "../DeskLink";
import type { ComparisonCertainty, ComparisonJudgement } from "#core/grade/assess";
import { ratings, type Downgrade, type Rating, type Suggestion } from "#core/grade/certainty";
import type { RiskOfBiasShares } from "#core/nma/risk-of-bias";
import { formatInterval } from "#core/publication/effects";
import { comparisonOf } from "#core/nma/comparison";
import { buttonClass, inputClass } from "./forms";
import { useBrief, useCertainty, useResult, useSaveJudgement, useSaveJudgements } from "../queries";

const domains = ["riskOfBias", "inconsistency", "indirectness", "publicationBias"] as const;
/** The bulk form's value for "each pair's own risk-of-bias suggestion". */
const suggested = "suggested";

/** "Suggested: no change." or "Suggested: 1 level down.": the plural form counts levels, never stands for a yes/no. */
const suggestedLevels = (t: (key: string, values?: Record<string, unknown>) => string, levels: number) =>
  levels === 0 ? t("desk.suggested.none") : t("desk.suggested.down", { count: levels });

export function CertaintyScreen({ canJudge }: { canJudge: boolean }) {
  const { t } = useTranslation();
  const { briefId = "", outcomeId = "" } = useParams();
  const certainty = useCertainty(outcomeId);
  const result = useResult(outcomeId);
  const brief = useBrief(briefId);
  const bulk = useSaveJudgements(outcomeId);
  const [open, setOpen] = useState<string | null>(null);
  const [selected, setSelected] = useState<Set<string>>(new Set());
  if (certainty.isError) return <p role="alert">{t("desk.error", { message: certainty.error.message })}</p>;
  if (!certainty.data || !result.data) return <p aria-live="polite">{t("desk.loading")}</p>;
  const analysed = result.data;
  // Each comparison as readers will read it: the names readers see, an option against the reference
  // (not the reference against it), those against the reference first.
  const names = new Map(brief.data?.treatments.map((treatment) => [treatment.label, treatment.displayName]) ?? []);
  const shownAs = (c: ComparisonCertainty) => {
    const [a, b] = c.treatment === analysed.reference ? [c.comparator, c.treatment] : [c.treatment, c.comparator];
    return { a, b, label: t("brief.versus", { treatment: names.get(a) ?? a, comparator: names.get(b) ?? b }) };
  };
  const againstReference = (c: ComparisonCertainty) => (c.treatment === analysed.reference || c.comparator === analysed.reference ? 0 : 1);
  const comparisons = [...certainty.data].sort((x, y) => againstReference(x) - againstReference(y) || shownAs(x).label.localeCompare(shownAs(y).label));
  const keyOf = (c: ComparisonCertainty) => `${c.treatment}|${c.comparator}`;
  const chosen = comparisons.filter((c) => selected.has(keyOf(c)));
  const pendingCount = comparisons.filter((c) => c.pending.length > 0).length;
  const rating = (value: string | null, exists: boolean) => (value ? t(`certainty.rating.${value}`) : exists ? t("desk.notRated") : t("desk.noEvidence"));
  const toggle = (key: string) => setSelected((now) => {
    const next = new Set(now);
    if (next.has(key)) next.delete(key);
    else next.add(key);
    return next;
  });
  const selectWhere = (which: (c: ComparisonCertainty) => boolean) => setSelected(new Set(comparisons.filter(which).map(keyOf)));
  // The computed suggestions for incoherence and imprecision, taken as they are; nothing else changes.
  const acceptSuggestions = () =>
    bulk.mutate(
      chosen.map((c) => ({
        treatment: c.treatment,
        comparator: c.comparator,
        judgement: {
          ...c.judgement,
          // The risk-of-bias suggestion (METHODS.md §13) where the pair's direct evidence is already judged; the other domains stay the analyst's.
          ...(c.judgement.direct && c.suggestions.riskOfBias ? { direct: { ...c.judgement.direct, riskOfBias: { levels: c.suggestions.riskOfBias.levels as Downgrade["levels"], reason: "" } } } : {}),
          incoherence: { levels: c.suggestions.incoherence.levels, reason: "" },
          imprecision: { levels: c.suggestions.imprecision.levels, reason: "" },
        },
      })),
    );
  return (
    <>
      <p className="font-sans text-sm">
        <DeskLink to={`/briefs/${briefId}/outcomes/${outcomeId}`}>{t("desk.results")}</DeskLink>
      </p>
      <h1 className="mt-2 text-3xl font-semibold">{t("desk.certainty")}</h1>
      <p className="mt-3 text-muted">{t("desk.certaintyLead")}</p>
      <p className="mt-3 font-sans font-semibold" data-testid="pending-count">
        {pendingCount > 0 ? t("desk.pendingCount", { count: pendingCount }) : t("desk.allJudged")}
      </p>
      {canJudge ? (
        <div className="mt-4 space-y-3 border border-rule bg-white p-4 font-sans text-sm" data-testid="bulk">
          <p>
            {t("desk.bulk.selected", { count: chosen.length })}{" "}
            <button type="button" className="underline" onClick={() => selectWhere((c) => c.pending.length > 0)}>{t("desk.bulk.selectPending")}</button>{" · "}
            <button type="button" className="underline" onClick={() => selectWhere(() => true)}>{t("desk.bulk.selectAll")}</button>{" · "}
            <button type="button" className="underline" onClick={() => setSelected(new Set())}>{t("desk.bulk.selectNone")}</button>
          </p>
          <button type="button" className={buttonClass} disabled={chosen.length === 0 || bulk.isPending} onClick={acceptSuggestions}>
            {t("desk.bulk.accept", { count: chosen.length })}
          </button>
          <DirectBulkForm chosen={chosen} busy={bulk.isPending} onApply={(items) => bulk.mutate(items)} />
          <IndirectBulkForm chosen={chosen} busy={bulk.isPending} onApply={(items) => bulk.mutate(items)} />
          {bulk.isSuccess ? <p role="status">{t("desk.bulk.saved", { count: bulk.data.comparisons.length })}</p> : null}
          {bulk.error ? <p role="alert" className="text-accent">{t("desk.error", { message: bulk.error.message })}</p> : null}
        </div>
      ) : null}
      <div className="mt-6 overflow-x-auto">
        <table className="w-full border-collapse font-sans text-sm">
          <thead>
            <tr className="border-b border-rule text-start">
              {canJudge ? <td /> : null}
              {(["comparison", "estimate", "direct", "indirect", "network", "suggested", "pending"] as const).map((c) => (
                <th key={c} scope="col" className="py-2 pe-3 text-start">
                  {t(`desk.column.${c}`, { measure: analysed.measure })}
                </th>
              ))}
              <td />
            </tr>
          </thead>
          <tbody>
            {comparisons.map((c) => {
              const key = keyOf(c);
              const shown = shownAs(c);
              const evidence = comparisonOf(analysed, shown.a, shown.b);
              return (
                <tr key={key} className="border-b border-rule align-top">
                  {canJudge ? (
                    <td className="py-2 pe-2">
                      <input type="checkbox" checked={selected.has(key)} onChange={() => toggle(key)} aria-label={t("desk.bulk.select", { treatment: names.get(shown.a) ?? shown.a, comparator: names.get(shown.b) ?? shown.b })} />
                    </td>
                  ) : null}
                  <th scope="row" className="py-2 pe-3 text-start font-semibold">
                    {shown.label}
                  </th>
                  <td className="py-2 pe-3 tabular-nums">
                    {evidence ? formatInterval(analysed.measure, evidence.network, t("brief.to")) : "—"}
                    <span className="block text-xs text-muted">{t("desk.studiesDirect", { count: evidence?.direct?.studies ?? 0 })}</span>
                  </td>
                  <td className="py-2 pe-3">{rating(c.direct, c.pending.includes("direct") || c.direct !== null)}</td>
                  <td className="py-2 pe-3">{rating(c.indirect, c.pending.includes("indirect") || c.indirect !== null)}</td>
                  <td className="py-2 pe-3 font-semibold">{c.network ? t(`certainty.rating.${c.network}`) : t("desk.notRated")}</td>
                  <td className="py-2 pe-3 text-xs">
                    {t("desk.suggestedShort", { incoherence: c.suggestions.incoherence.levels, imprecision: c.suggestions.imprecision.levels })}
                    {c.suggestions.riskOfBias ? <span className="block">{t("desk.riskOfBias.suggestedShort", { levels: c.suggestions.riskOfBias.levels })}</span> : null}
                  </td>
                  <td className="py-2 pe-3">{c.pending.map((p) => t(`desk.pending.${p}`)).join(", ")}</td>
                  <td className="py-2">
                    {canJudge ? (
                      <button type="button" className="text-accent underline" onClick={() => setOpen(open === key ? null : key)} aria-expanded={open === key}>
                        {t("desk.judge")}
                      </button>
                    ) : null}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      {comparisons
        .filter((c) => open === keyOf(c))
        .map((c) => (
          <JudgementForm key={keyOf(c)} outcomeId={outcomeId} comparison={c} title={shownAs(c).label} shares={comparisonOf(analysed, c.treatment, c.comparator)?.riskOfBias ?? null} />
        ))}
    </>
  );
}

/**
 * The indirect certainty, with its reason, for every selected pair whose indirect evidence has no
 * first-order loop (METHODS.md §8 steps 2 and 4): the analysts set it from the longer paths.
 */
function IndirectBulkForm({ chosen, busy, onApply }: { chosen: ComparisonCertainty[]; busy: boolean; onApply: (items: { treatment: string; comparator: string; judgement: ComparisonJudgement }[]) => void }) {
  const { t } = useTranslation();
  const withoutLoop = chosen.filter((c) => c.indirectVia === null && (c.indirect !== null || c.pending.includes("indirect")));
  if (withoutLoop.length === 0) return null;
  return (
    <form
      className="grid gap-2"
      aria-label={t("desk.bulk.indirectTitle", { count: withoutLoop.length })}
      onSubmit={(event) => {
        event.preventDefault();
        const data = new FormData(event.currentTarget);
        const indirectRating = { rating: String(data.get("indirectRating")) as Rating, reason: String(data.get("reason") ?? "") };
        onApply(withoutLoop.map((c) => ({ treatment: c.treatment, comparator: c.comparator, judgement: { ...c.judgement, indirectRating } })));
      }}
    >
      <p className="font-semibold">{t("desk.bulk.indirectTitle", { count: withoutLoop.length })}</p>
      <div className="flex flex-wrap gap-3">
        <select name="indirectRating" required defaultValue="" className={inputClass} aria-label={t("desk.indirectRatingLabel")}>
          <option value="" disabled>—</option>
          {[...ratings].reverse().map((r) => (
            <option key={r} value={r}>{t(`certainty.rating.${r}`)}</option>
          ))}
        </select>
        <input name="reason" required placeholder={t("desk.bulk.indirectReason")} aria-label={t("desk.bulk.indirectReason")} className={`${inputClass} min-w-[16rem] flex-1`} />
      </div>
      <div>
        <button type="submit" className="border border-ink px-5 py-2 font-semibold" disabled={busy}>{t("desk.bulk.applyIndirect", { count: withoutLoop.length })}</button>
      </div>
    </form>
  );
}

/** One judgement of the direct evidence (the four domains, one reason) for every selected pair that has direct evidence. */
function DirectBulkForm({ chosen, busy, onApply }: { chosen: ComparisonCertainty[]; busy: boolean; onApply: (items: { treatment: string; comparator: string; judgement: ComparisonJudgement }[]) => void }) {
  const { t } = useTranslation();
  const withDirect = chosen.filter((c) => c.direct !== null || c.pending.includes("direct"));
  const anySuggestion = withDirect.some((c) => c.suggestions.riskOfBias !== null);
  return (
    <form
      className="grid gap-2"
      aria-label={t("desk.bulk.directTitle")}
      onSubmit={(event) => {
        event.preventDefault();
        const data = new FormData(event.currentTarget);
        const reason = String(data.get("reason") ?? "");
        const domain = (d: (typeof domains)[number]) => {
          const levels = Number(data.get(d)) as 0 | 1 | 2;
          return { levels, reason: levels > 0 ? reason : "" };
        };
        const direct = { riskOfBias: domain("riskOfBias"), inconsistency: domain("inconsistency"), indirectness: domain("indirectness"), publicationBias: domain("publicationBias") };
        // "As suggested": each pair takes its own computed risk-of-bias suggestion, without a reason (none to depart from).
        const riskOfBias = (c: ComparisonCertainty): Downgrade =>
          data.get("riskOfBias") === suggested ? { levels: (c.suggestions.riskOfBias?.levels ?? 0) as Downgrade["levels"], reason: "" } : direct.riskOfBias;
        onApply(withDirect.map((c) => ({ treatment: c.treatment, comparator: c.comparator, judgement: { ...c.judgement, direct: { ...direct, riskOfBias: riskOfBias(c) } } })));
      }}
    >
      <p className="font-semibold">{t("desk.bulk.directTitle", { count: withDirect.length })}</p>
      <div className="flex flex-wrap gap-3">
        {domains.map((d) => (
          <label key={d} className="grid gap-1">
            <span>{t(`desk.domain.${d}`)}</span>
            <select key={String(anySuggestion)} name={d} defaultValue={d === "riskOfBias" && anySuggestion ? suggested : "0"} className={inputClass}>
              {d === "riskOfBias" && anySuggestion ? <option value={suggested}>{t("desk.riskOfBias.asSuggested")}</option> : null}
              {[0, 1, 2].map((level) => (
                <option key={level} value={level}>{t(`desk.levels.${level}`)}</option>
              ))}
            </select>
          </label>
        ))}
      </div>
      <input name="reason" placeholder={t("desk.bulk.reason")} aria-label={t("desk.bulk.reason")} className={inputClass} />
      <div>
        <button type="submit" className="border border-ink px-5 py-2 font-semibold" disabled={withDirect.length === 0 || busy}>{t("desk.bulk.applyDirect", { count: withDirect.length })}</button>
      </div>
    </form>
  );
}

/** The direct evidence's shares by risk of bias (METHODS.md §13) and what they suggest: advice beside the domain, never a rule. */
function RiskOfBiasAdvice({ shares, suggestion }: { shares: RiskOfBiasShares | null; suggestion: Suggestion | null }) {
  const { t } = useTranslation();
  if (!shares) return <p className="mt-1 text-muted">{t("desk.riskOfBias.noColumn")}</p>;
  const percent = (x: number) => Math.round(100 * x);
  return (
    <p className="mt-1 text-muted" data-testid="risk-of-bias-advice">
      {t("desk.riskOfBias.shares", { low: percent(shares.low), someConcerns: percent(shares.someConcerns), high: percent(shares.high), notAssessed: percent(shares.notAssessed) })}{" "}
      {suggestion ? `${suggestedLevels(t, suggestion.levels)} ${t(suggestion.because.key, suggestion.because.values)}` : t("desk.riskOfBias.noSuggestion")}
    </p>
  );
}

function DowngradeField({ name, label, value }: { name: string; label: string; value: Downgrade | undefined }) {
  const { t } = useTranslation();
  return (
    <fieldset className="grid gap-2 sm:grid-cols-[14rem_12rem_1fr] sm:items-center">
      <legend className="sr-only">{label}</legend>
      <span className="font-semibold">{label}</span>
      <select name={`${name}.levels`} defaultValue={String(value?.levels ?? 0)} className={inputClass} aria-label={label}>
        {[0, 1, 2].map((level) => (
          <option key={level} value={level}>
            {t(`desk.levels.${level}`)}
          </option>
        ))}
      </select>
      <input name={`${name}.reason`} defaultValue={value?.reason ?? ""} placeholder={t("desk.reason")} aria-label={`${label}: ${t("desk.reason")}`} className={inputClass} />
    </fieldset>
  );
}

function JudgementForm({ outcomeId, comparison, title, shares }: { outcomeId: string; comparison: ComparisonCertainty; title: string; shares: RiskOfBiasShares | null }) {
  const { t } = useTranslation();
  const robSuggestion = comparison.suggestions.riskOfBias;
  const save = useSaveJudgement(outcomeId);
  const j = comparison.judgement;
  const hasDirect = comparison.direct !== null || comparison.pending.includes("direct");
  const hasLoop = comparison.indirectVia !== null;
  const hasIndirect = comparison.indirect !== null || comparison.pending.includes("indirect");
  const decision = (name: "incoherence" | "imprecision") => j[name] ?? { levels: comparison.suggestions[name].levels, reason: "" };
  return (
    <form
      aria-label={`${t("desk.judge")}: ${title}`}
      className="mt-8 space-y-4 border border-rule bg-white p-5 font-sans text-sm"
      onSubmit={(event) => {
        event.preventDefault();
        const data = new FormData(event.currentTarget);
        const read = (name: string): Downgrade => ({ levels: Number(data.get(`${name}.levels`)) as 0 | 1 | 2, reason: String(data.get(`${name}.reason`) ?? "") });
        const judgement: ComparisonJudgement = {
          ...(hasDirect ? { direct: { riskOfBias: read("riskOfBias"), inconsistency: read("inconsistency"), indirectness: read("indirectness"), publicationBias: read("publicationBias") } } : {}),
          ...(hasLoop ? { intransitivity: read("intransitivity") } : {}),
          ...(hasIndirect && !hasLoop && data.get("indirectRating")
            ? { indirectRating: { rating: data.get("indirectRating") as Rating, reason: String(data.get("indirectRating.reason") ?? "") } }
            : {}),
          ...(hasDirect && hasIndirect ? { dominant: (data.get("dominant") || null) as "direct" | "indirect" | null } : {}),
          // Incoherence needs both kinds of evidence (METHODS.md §8 step 4): a pair no trial compared has none to judge.
          ...(hasDirect ? { incoherence: read("incoherence") } : {}),
          imprecision: read("imprecision"),
        };
        save.mutate({ treatment: comparison.treatment, comparator: comparison.comparator, judgement });
      }}
    >
      <h2 className="text-lg font-semibold">{title}</h2>
      {hasDirect
        ? domains.map((d) =>
            d === "riskOfBias" ? (
              <div key={d}>
                <DowngradeField name={d} label={t(`desk.domain.${d}`)} value={j.direct?.riskOfBias ?? (robSuggestion ? { levels: robSuggestion.levels as Downgrade["levels"], reason: "" } : undefined)} />
                <RiskOfBiasAdvice shares={shares} suggestion={robSuggestion} />
              </div>
            ) : (
              <DowngradeField key={d} name={d} label={t(`desk.domain.${d}`)} value={j.direct?.[d]} />
            ),
          )
        : null}
      {hasLoop && hasIndirect ? <DowngradeField name="intransitivity" label={t("desk.domain.intransitivity", { via: comparison.indirectVia })} value={j.intransitivity} /> : null}
      {hasIndirect && !hasLoop ? (
        <fieldset className="grid gap-2 sm:grid-cols-[14rem_12rem_1fr] sm:items-center">
          <legend className="sr-only">{t("desk.indirectRatingLabel")}</legend>
          <span className="font-semibold">{t("desk.indirectRatingLabel")}</span>
          <select name="indirectRating" defaultValue={j.indirectRating?.rating ?? ""} className={inputClass} aria-label={t("desk.indirectRatingLabel")}>
            <option value="">—</option>
            {[...ratings].reverse().map((r) => (
              <option key={r} value={r}>
                {t(`certainty.rating.${r}`)}
              </option>
            ))}
          </select>
          <input name="indirectRating.reason" defaultValue={j.indirectRating?.reason ?? ""} placeholder={t("desk.reason")} aria-label={`${t("desk.indirectRatingLabel")}: ${t("desk.reason")}`} className={inputClass} />
        </fieldset>
      ) : null}
      {hasDirect && hasIndirect ? (
        <label className="grid gap-2 sm:grid-cols-[14rem_12rem] sm:items-center">
          <span className="font-semibold">{t("desk.dominant.label")}</span>
          <select name="dominant" defaultValue={j.dominant ?? ""} className={inputClass}>
            <option value="">{t("desk.dominant.higher")}</option>
            <option value="direct">{t("desk.dominant.direct")}</option>
            <option value="indirect">{t("desk.dominant.indirect")}</option>
          </select>
        </label>
      ) : null}
      {(hasDirect ? (["incoherence", "imprecision"] as const) : (["imprecision"] as const)).map((name) => (
        <div key={name}>
          <DowngradeField name={name} label={t(`desk.domain.${name}`)} value={decision(name) as Downgrade} />
          <p className="mt-1 text-muted">
            {suggestedLevels(t, comparison.suggestions[name].levels)} {t(comparison.suggestions[name].because.key, comparison.suggestions[name].because.values)}
          </p>
        </div>
      ))}
      <button type="submit" disabled={save.isPending} className={buttonClass}>
        {save.isPending ? t("desk.saving") : t("desk.saveJudgement")}
      </button>
      {save.isSuccess ? <p role="status">{t("desk.saved")}</p> : null}
      {save.error ? <p role="alert" className="text-accent">{t("desk.error", { message: save.error.message })}</p> : null}
    </form>
  );
}
