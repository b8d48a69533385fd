/**
 * Conversions between what a form field holds and what the API takes, for react-hook-form's `setValueAs`.
 * An empty text box or an unpicked select means "none" (null), never "" or 0.
 */
export const emptyToNull = (v: unknown) => (v === "" || v === undefined ? null : v);
