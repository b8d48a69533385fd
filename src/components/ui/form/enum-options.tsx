/** The <option>s of a select over a fixed list of values, each shown by its label. */
export function EnumOptions<T extends string>({ values, labels }: { values: readonly T[]; labels: Record<T, string> }) {
  return values.map((v) => (
    <option key={v} value={v}>
      {labels[v]}
    </option>
  ));
}
