/** True when the previous history entry is a page of this app (React Router numbers its entries from 0). */
export function canGoBack(): boolean {
  const state = window.history.state as { idx?: number } | null;
  return typeof state?.idx === "number" && state.idx > 0;
}
