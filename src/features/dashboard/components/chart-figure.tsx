import { useId, useState, type ReactNode } from "react";
import { Table2 } from "lucide-react";
import { Button } from "@/components/ui/button";
import { cn } from "@/utils/cn";

export type FigureColumn<Row> = { header: string; cell: (row: Row) => ReactNode; numeric?: boolean };

/**
 * One chart with its numbers. The drawing is a single image to assistive technology (role="img" with a name);
 * the same figures are always in a table (captioned) that screen readers read, and anyone can show it.
 */
export function ChartFigure<Row>({
  title,
  summary,
  rows,
  columns,
  rowKey,
  empty,
  children,
  testId,
}: {
  title: string;
  /** One sentence for the drawing's accessible name, e.g. "Bar chart of open jobs by stage". */
  summary: string;
  rows: Row[];
  columns: FigureColumn<Row>[];
  rowKey: (row: Row) => string;
  /** Shown instead of the chart when there are no rows. */
  empty: string;
  children: ReactNode;
  testId?: string;
}) {
  const headingId = useId();
  const tableId = useId();
  const [showTable, setShowTable] = useState(false);
  return (
    <section aria-labelledby={headingId} data-testid={testId} className="flex flex-col rounded-xl border border-primer-200 bg-white shadow-card">
      <div className="flex flex-wrap items-center justify-between gap-2 border-b border-primer-200 px-4 py-3 sm:px-5">
        <h2 id={headingId} className="text-lg font-semibold text-ink-950">
          {title}
        </h2>
        {rows.length ? (
          <Button
            variant="ghost"
            size="sm"
            aria-expanded={showTable}
            aria-controls={tableId}
            onClick={() => setShowTable((v) => !v)}
            icon={<Table2 aria-hidden className="size-4" />}
          >
            {showTable ? "Hide numbers" : "Show numbers"}
          </Button>
        ) : null}
      </div>
      <div className="p-4 sm:p-5">
        {rows.length === 0 ? (
          <p className="py-8 text-center text-sm text-primer-700">{empty}</p>
        ) : (
          <>
            <div role="img" aria-label={`${summary}. The figures are in the table "${title}".`} className="h-64 w-full">
              {children}
            </div>
            <div id={tableId} className={cn(showTable ? "mt-4 overflow-x-auto" : "sr-only")}>
              <table className="w-full border-collapse text-left text-sm">
                <caption className={cn(showTable ? "mb-2 text-left text-sm font-semibold text-ink-950" : undefined)}>{title}</caption>
                <thead className="bg-primer-100">
                  <tr>
                    {columns.map((c) => (
                      <th key={c.header} scope="col" className={cn("border-b border-primer-200 px-3 py-2 font-semibold", c.numeric && "text-right")}>
                        {c.header}
                      </th>
                    ))}
                  </tr>
                </thead>
                <tbody>
                  {rows.map((row) => (
                    <tr key={rowKey(row)} className="border-b border-primer-100 last:border-b-0">
                      {columns.map((c, i) => {
                        const Cell = i === 0 ? "th" : "td";
                        return (
                          <Cell key={c.header} {...(i === 0 ? { scope: "row" } : {})} className={cn("px-3 py-2 font-normal", c.numeric && "text-right tabular-nums")}>
                            {c.cell(row)}
                          </Cell>
                        );
                      })}
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          </>
        )}
      </div>
    </section>
  );
}
