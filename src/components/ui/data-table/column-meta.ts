import type { RowData } from "@tanstack/react-table";

declare module "@tanstack/react-table" {
  // eslint-disable-next-line @typescript-eslint/no-unused-vars -- a merged declaration must repeat the library's type parameters
  interface ColumnMeta<TData extends RowData, TValue> {
    /** Classes for this column's <th> and <td> (alignment, width, hiding on small screens). */
    className?: string;
    /** Render the cell as the row header (<th scope="row">). */
    rowHeader?: boolean;
  }
}

export {};
