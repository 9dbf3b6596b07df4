// Certainty per comparison: what is rated, what still needs a judgement, and a form for one pair.
import { useState } from "react";
import { useTranslation } from "react-i18next";
import { Link, useParams } from "react-router";
import type { ComparisonCertainty, ComparisonJudgement } from "#core/grade/assess";
import { ratings, type Downgrade, type Rating } from "#core/grade/certainty";
import { buttonClass, inputClass } from "./forms";
import { useCertainty, useSaveJudgement } from "./queries";

const domains = ["riskOfBias", "inconsistency", "indirectness", "publicationBias"] as const;

export function CertaintyScreen({ canJudge }: { canJudge: boolean }) {
  const { t } = useTranslation();
  const { briefId = "", outcomeId = "" } = useParams();
  const certainty = useCertainty(outcomeId);
  const [open, setOpen] = useState<string | null>(null);
  if (certainty.isError) return <p role="alert">{t("desk.error", { message: certainty.error.message })}</p>;
  if (!certainty.data) return <p aria-live="polite">{t("desk.loading")}</p>;
  const pendingCount = certainty.data.filter((c) => c.pending.length > 0).length;
  const rating = (value: string | null, exists: boolean) => (value ? t(`certainty.rating.${value}`) : exists ? t("desk.notRated") : t("desk.noEvidence"));
  return (
    <>
      <p className="font-sans text-sm">
        <Link to={`/briefs/${briefId}/outcomes/${outcomeId}`}>{t("desk.results")}</Link>
      </p>
      <h1 className="mt-2 text-3xl font-semibold">{t("desk.certainty")}</h1>
      <p className="mt-3 text-muted">{t("desk.certaintyLead")}</p>
      <p className="mt-3 font-sans font-semibold" data-testid="pending-count">
        {pendingCount > 0 ? t("desk.pendingCount", { count: pendingCount }) : t("desk.allJudged")}
      </p>
      <table className="mt-6 w-full border-collapse font-sans text-sm">
        <thead>
          <tr className="border-b border-rule text-start">
            {(["comparison", "direct", "indirect", "network", "pending"] as const).map((c) => (
              <th key={c} scope="col" className="py-2 pe-3 text-start">
                {t(`desk.column.${c}`)}
              </th>
            ))}
            <td />
          </tr>
        </thead>
        <tbody>
          {certainty.data.map((c) => {
            const key = `${c.treatment}|${c.comparator}`;
            return (
              <tr key={key} className="border-b border-rule align-top">
                <th scope="row" className="py-2 pe-3 text-start font-semibold">
                  {c.treatment} vs {c.comparator}
                </th>
                <td className="py-2 pe-3">{rating(c.direct, c.pending.includes("direct") || c.direct !== null)}</td>
                <td className="py-2 pe-3">{rating(c.indirect, c.pending.includes("indirect") || c.indirect !== null)}</td>
                <td className="py-2 pe-3 font-semibold">{c.network ? t(`certainty.rating.${c.network}`) : t("desk.notRated")}</td>
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
      {certainty.data
        .filter((c) => open === `${c.treatment}|${c.comparator}`)
        .map((c) => (
          <JudgementForm key={`${c.treatment}|${c.comparator}`} outcomeId={outcomeId} comparison={c} />
        ))}
    </>
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

function JudgementForm({ outcomeId, comparison }: { outcomeId: string; comparison: ComparisonCertainty }) {
  const { t } = useTranslation();
  const save = useSaveJudgement(outcomeId);
  const j = comparison.judgement;
  const hasDirect = comparison.direct !== null || comparison.pending.includes("direct");
  const hasLoop = comparison.indirectVia !== null;
  const hasIndirect = comparison.indirect !== null || comparison.pending.includes("indirect");
  const decision = (name: "incoherence" | "imprecision") => j[name] ?? { levels: comparison.suggestions[name].levels, reason: "" };
  return (
    <form
      aria-label={`${t("desk.judge")}: ${comparison.treatment} vs ${comparison.comparator}`}
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
          incoherence: read("incoherence"),
          imprecision: read("imprecision"),
        };
        save.mutate({ treatment: comparison.treatment, comparator: comparison.comparator, judgement });
      }}
    >
      <h2 className="text-lg font-semibold">
        {comparison.treatment} vs {comparison.comparator}
      </h2>
      {hasDirect ? domains.map((d) => <DowngradeField key={d} name={d} label={t(`desk.domain.${d}`)} value={j.direct?.[d]} />) : null}
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
      {(["incoherence", "imprecision"] as const).map((name) => (
        <div key={name}>
          <DowngradeField name={name} label={t(`desk.domain.${name}`)} value={decision(name) as Downgrade} />
          <p className="mt-1 text-muted">
            {t("desk.suggested", { levels: comparison.suggestions[name].levels })} {t(comparison.suggestions[name].because.key, comparison.suggestions[name].because.values)}
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
