// The league table: every treatment against every other, row vs column, with its 95% CI.
import { useTranslation } from "react-i18next";
import { formatInterval } from "#core/publication/effects";
import type { Measure } from "#core/nma/types";
import { useIntl } from "../i18n";

export interface LeagueCell {
  estimate: number;
  lower: number;
  upper: number;
}

export function LeagueTable({
  treatments,
  cell,
  href,
  measure,
  caption,
}: {
  treatments: { id: string; label: string }[];
  cell: (row: string, column: string) => LeagueCell | null;
  /** Where a cell links to: the page of "row vs column". */
  href?: (row: string, column: string) => string;
  measure: Measure;
  caption: string;
}) {
  const { t } = useTranslation();
  const intl = useIntl();
  return (
    // Scrolls inside its own box, with the row and column headers kept in view (sticky).
    <div className="max-h-[80vh] overflow-auto">
      <table className="border-collapse font-sans text-xs" data-testid="league-table">
        <caption className="mb-2 text-start text-sm text-muted">{caption}</caption>
        <thead>
          <tr>
            <td className="sticky start-0 top-0 z-20 bg-paper" />
            {treatments.map((t) => (
              <th key={t.id} scope="col" className="sticky top-0 z-10 border border-rule bg-paper px-2 py-1 font-semibold">
                {t.label}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {treatments.map((row) => (
            <tr key={row.id}>
              <th scope="row" className="sticky start-0 z-10 border border-rule bg-paper px-2 py-1 text-start font-semibold">
                {row.label}
              </th>
              {treatments.map((column) => {
                const value = row.id === column.id ? null : cell(row.id, column.id);
                return (
                  <td key={column.id} className="border border-rule px-2 py-1 text-center whitespace-nowrap">
                    {value && href ? (
                      <a href={href(row.id, column.id)} aria-label={t("brief.leagueCellLabel", { treatment: row.label, comparator: column.label, value: formatInterval(measure, value, t("brief.to"), intl.locale) })}>
                        {formatInterval(measure, value, t("brief.to"), intl.locale)}
                      </a>
                    ) : value ? (
                      formatInterval(measure, value, t("brief.to"), intl.locale)
                    ) : (
                      "—"
                    )}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
