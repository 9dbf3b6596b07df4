// A forest plot of each treatment against the reference: point estimate and 95% CI, the line of no
// effect, ratios on a log axis. The rows are also given as text beside the figure (table below it).
import { Group } from "@visx/group";
import { scaleLinear } from "@visx/scale";
import { Line } from "@visx/shape";
import { useTranslation } from "react-i18next";
import { formatInterval, formatTick, isRatio } from "#core/publication/effects";
import type { Measure } from "#core/nma/types";
import { axisTicks } from "./scale";
import { textDirection, useIntl } from "../i18n";

/** What the axis says: the measure, and which side of the line of no effect favours whom. */
export interface ForestAxis {
  better: "higher" | "lower";
  referenceName: string;
  unit?: string | null;
}

export interface ForestRow {
  label: string;
  estimate: number;
  lower: number;
  upper: number;
}

const rowHeight = 28;
const plotWidth = 460;

export function ForestPlot({ rows, measure, title, axis }: { rows: ForestRow[]; measure: Measure; title: string; axis: ForestAxis }) {
  const { t } = useTranslation();
  const intl = useIntl();
  // Room beside the plot for the longest label at 13 px (about 7 px a character): on the left, or in
  // right-to-left languages on the right, where reading starts. The axis keeps its mathematical
  // direction (smaller values on the left) in every language.
  const rtl = textDirection(intl.locale) === "rtl";
  const labelWidth = 7 * Math.max(8, ...rows.map((r) => r.label.length));
  const margin = { top: 8, right: 24 + (rtl ? labelWidth : 0), bottom: 76, left: 24 + (rtl ? 0 : labelWidth) };
  // Each row is the option against the reference: where higher is better, the side of higher values
  // favours the option; where lower is better, the side of lower values does.
  const option = t("brief.forestAxis.favoursOption");
  const reference = t("brief.forestAxis.favours", { name: axis.referenceName });
  const [leftSide, rightSide] = axis.better === "higher" ? [reference, option] : [option, reference];
  const measureWords = t(`brief.measure.${measure}`);
  const measureName = measureWords.charAt(0).toLocaleUpperCase(intl.locale) + measureWords.slice(1);
  const axisTitle = isRatio(measure) ? t("brief.forestAxis.ratio", { measure: measureName }) : axis.unit ? t("brief.forestAxis.withUnit", { measure: measureName, unit: axis.unit }) : measureName;
  const width = margin.left + plotWidth + margin.right;
  const height = margin.top + margin.bottom + rows.length * rowHeight;
  const lowest = Math.min(0, ...rows.map((r) => r.lower));
  const highest = Math.max(0, ...rows.map((r) => r.upper));
  const pad = (highest - lowest) * 0.05 || 0.1;
  const x = scaleLinear({ domain: [lowest - pad, highest + pad], range: [0, width - margin.left - margin.right], nice: true });
  // On a phone: each label on its own line above its interval, the axis the whole width, so that
  // every estimate and interval is in sight without scrolling (the same scale rule: it holds them all).
  const narrowWidth = 344;
  const narrowRow = 46;
  const narrowX = scaleLinear({ domain: [lowest - pad, highest + pad], range: [0, narrowWidth], nice: true });
  const narrowMargin = { top: 4, side: 8, bottom: 76 };
  const narrowHeight = narrowMargin.top + narrowMargin.bottom + rows.length * narrowRow;
  const axisGroup = (scale: typeof x, across: number, ticks: number) => (
    <>
      <line x1={0} x2={across} stroke="#d9d1c5" />
      {axisTicks(measure, scale.domain() as [number, number], scale.ticks(ticks)).map((tick) => (
        <g key={tick} transform={`translate(${scale(tick)} 0)`}>
          <line y2={6} stroke="#d9d1c5" />
          <text y={20}>{formatTick(measure, tick, intl.locale)}</text>
        </g>
      ))}
      <text x={across / 2} y={40} fill="#1d1a17" data-testid="forest-axis-title">
        {axisTitle}
      </text>
      {/* The arrows stand apart from the words, so that right-to-left words cannot move them off the outer edge. */}
      <text x={0} y={62} textAnchor="start" aria-hidden="true">←</text>
      <text x={16} y={62} textAnchor="start" direction="ltr" data-testid="forest-left-side">
        {leftSide}
      </text>
      <text x={across - 16} y={62} textAnchor="end" direction="ltr" data-testid="forest-right-side">
        {rightSide}
      </text>
      <text x={across} y={62} textAnchor="end" aria-hidden="true">→</text>
    </>
  );
  return (
    <figure className="my-6">
      <svg viewBox={`0 0 ${width} ${height}`} direction="ltr" role="img" aria-label={title} className="hidden w-full max-w-2xl font-sans sm:block" data-testid="forest-plot">
        <title>{title}</title>
        <Group left={margin.left} top={margin.top}>
          <Line from={{ x: x(0), y: 0 }} to={{ x: x(0), y: rows.length * rowHeight }} stroke="#5b554d" strokeDasharray="4 3" />
          {rows.map((row, i) => {
            const y = i * rowHeight + rowHeight / 2;
            return (
              <g key={row.label}>
                <text x={rtl ? plotWidth + labelWidth + 12 : -12} y={y} dy="0.35em" textAnchor={rtl ? "start" : "end"} direction={rtl ? "rtl" : "ltr"} fontSize={13} fill="#1d1a17">
                  {row.label}
                </text>
                <Line from={{ x: x(row.lower), y }} to={{ x: x(row.upper), y }} stroke="#6d1f35" strokeWidth={2} />
                <rect x={x(row.estimate) - 5} y={y - 5} width={10} height={10} fill="#6d1f35" />
              </g>
            );
          })}
          {/* The axis: a rule and a few ticks, drawn here rather than with an axis package that weighs more than the plot. */}
          <g transform={`translate(0 ${rows.length * rowHeight})`} fontSize={11} fill="#5b554d" textAnchor="middle">
            {axisGroup(x, plotWidth, 6)}
          </g>
        </Group>
      </svg>
      <svg viewBox={`0 0 ${narrowWidth + 2 * narrowMargin.side} ${narrowHeight}`} direction="ltr" role="img" aria-label={title} className="w-full font-sans sm:hidden" data-testid="forest-plot-narrow">
        <title>{title}</title>
        <Group left={narrowMargin.side} top={narrowMargin.top}>
          {rows.map((row, i) => {
            const top = i * narrowRow;
            return (
              <g key={row.label}>
                {/* The line of no effect under each label, never through it. */}
                <Line from={{ x: narrowX(0), y: top + 20 }} to={{ x: narrowX(0), y: top + narrowRow }} stroke="#5b554d" strokeDasharray="4 3" />
                {/* The label on its own line, from the side reading starts. */}
                <text x={rtl ? narrowWidth : 0} y={top + 14} textAnchor="start" direction={rtl ? "rtl" : "ltr"} fontSize={14} fill="#1d1a17">
                  {row.label}
                </text>
                <Line from={{ x: narrowX(row.lower), y: top + 32 }} to={{ x: narrowX(row.upper), y: top + 32 }} stroke="#6d1f35" strokeWidth={2} />
                <rect x={narrowX(row.estimate) - 5} y={top + 27} width={10} height={10} fill="#6d1f35" />
              </g>
            );
          })}
          <g transform={`translate(0 ${rows.length * narrowRow})`} fontSize={12} fill="#5b554d" textAnchor="middle">
            {axisGroup(narrowX, narrowWidth, 4)}
          </g>
        </Group>
      </svg>
      <figcaption className="sr-only">
        {rows.map((r) => `${r.label}: ${formatInterval(measure, r, t("brief.to"), intl.locale)}`).join("; ")}
      </figcaption>
    </figure>
  );
}


