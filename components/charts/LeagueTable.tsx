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
  const to = t("brief.to");
  return (
    // Scrolls inside its own box, with the row and column headers kept in view (sticky). The body
    // cells take their look from the table (a 22-option brief has 462 of them: one class list, not 462).
    <div className="max-h-[80vh] overflow-auto">
      <table
        className="border-collapse font-sans text-xs [&_tbody_td]:border [&_tbody_td]:border-rule [&_tbody_td]:px-2 [&_tbody_td]:py-1 [&_tbody_td]:text-center [&_tbody_td]:whitespace-nowrap"
        data-testid="league-table"
      >
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
                const text = value ? formatInterval(measure, value, to, intl.locale) : "—";
                return (
                  <td key={column.id}>
                    {value && href ? (
                      <a href={href(row.id, column.id)} aria-label={t("brief.leagueCellLabel", { treatment: row.label, comparator: column.label, value: text })}>
                        {text}
                      </a>
                    ) : (
                      text
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
