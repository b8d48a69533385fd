import type { FieldValues, Path, UseFormSetError } from "react-hook-form";
import { isApiError } from "./api-client";

/**
 * Puts a failed submit's errors where the user will see them: each field message the server sent for a field
 * this form has goes beside that field; the rest becomes one form-level message (returned).
 */
export function applyServerErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  formFields: readonly Path<T>[],
): string {
  if (!isApiError(error)) return "Something went wrong. Try again.";
  if (error.code === "version_conflict") return versionConflictMessage(error.message);
  let placed = 0;
  const leftovers: string[] = [];
  for (const [field, message] of Object.entries(error.fields)) {
    if ((formFields as readonly string[]).includes(field)) {
      setError(field as Path<T>, { type: "server", message }, { shouldFocus: placed === 0 });
      placed++;
    } else {
      leftovers.push(message);
    }
  }
  if (placed > 0 && leftovers.length === 0 && error.status === 400) return "Check the highlighted fields.";
  return error.message;
}

/** Who saved first and when (the server's words), and the two ways on. */
export const versionConflictMessage = (serverMessage: string) =>
  `${serverMessage} What you typed is still here: save again to put your changes over theirs, or cancel to keep theirs.`;
