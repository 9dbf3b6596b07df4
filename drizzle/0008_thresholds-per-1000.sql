-- Thresholds of binary outcomes move from the analysis scale (log OR, log RR, RD) to the difference
-- per 1000 people at the outcome's baseline risk (methods §9; docs/decisions/0017-thresholds-per-1000.md).
-- A stored magnitude t becomes 1000·(p₁ − p₀) with p₁ the risk under an effect of +t at p₀ (§7).
-- Without a baseline risk a per-1000 threshold has no meaning: those thresholds are cleared, and the
-- outcome reads by the minimally contextualised framework until the analyst enters them again.
UPDATE "outcomes" SET
  "threshold_small" = CASE WHEN "baseline_risk" IS NULL THEN NULL
    WHEN "measure" = 'OR' THEN round((1000 * (exp("threshold_small") * "baseline_risk" / (1 - "baseline_risk" + exp("threshold_small") * "baseline_risk") - "baseline_risk"))::numeric, 1)::double precision
    WHEN "measure" = 'RR' THEN round((1000 * (least(1, exp("threshold_small") * "baseline_risk") - "baseline_risk"))::numeric, 1)::double precision
    ELSE round((1000 * "threshold_small")::numeric, 1)::double precision END,
  "threshold_moderate" = CASE WHEN "baseline_risk" IS NULL THEN NULL
    WHEN "measure" = 'OR' THEN round((1000 * (exp("threshold_moderate") * "baseline_risk" / (1 - "baseline_risk" + exp("threshold_moderate") * "baseline_risk") - "baseline_risk"))::numeric, 1)::double precision
    WHEN "measure" = 'RR' THEN round((1000 * (least(1, exp("threshold_moderate") * "baseline_risk") - "baseline_risk"))::numeric, 1)::double precision
    ELSE round((1000 * "threshold_moderate")::numeric, 1)::double precision END,
  "threshold_large" = CASE WHEN "baseline_risk" IS NULL THEN NULL
    WHEN "measure" = 'OR' THEN round((1000 * (exp("threshold_large") * "baseline_risk" / (1 - "baseline_risk" + exp("threshold_large") * "baseline_risk") - "baseline_risk"))::numeric, 1)::double precision
    WHEN "measure" = 'RR' THEN round((1000 * (least(1, exp("threshold_large") * "baseline_risk") - "baseline_risk"))::numeric, 1)::double precision
    ELSE round((1000 * "threshold_large")::numeric, 1)::double precision END
WHERE "kind" = 'binary' AND ("threshold_small" IS NOT NULL OR "threshold_moderate" IS NOT NULL OR "threshold_large" IS NOT NULL);
