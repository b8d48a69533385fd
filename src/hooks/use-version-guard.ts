import { useState } from "react";
import { isApiError } from "@/lib/api-client";

export type VersionConflict<T> = { current: T; changedBy: string | null; changedAt: string | null };

/**
 * Saving a record someone else may be editing. The form keeps the version it was opened at and sends it with each
 * save; when the server answers 409 `version_conflict`, the conflict (their record, who, when) is kept here and the
 * form keeps what the user typed. The user then takes their version (`reload`) or saves theirs over it
 * (`saveAgain`, which sends the newer version).
 */
export function useVersionGuard<T extends { version: number }, V>(record: T, save: (values: V, version: number) => Promise<unknown>) {
  const [opened, setOpened] = useState({ id: record, version: record.version });
  const [conflict, setConflict] = useState<VersionConflict<T> | null>(null);
  const [last, setLast] = useState<V | null>(null);
  // A newer record from the server (after this user's own save, or a reload) becomes the version edits start from.
  if (opened.id !== record && !conflict) setOpened({ id: record, version: record.version });

  const run = async (values: V, version: number): Promise<boolean> => {
    setLast(values);
    try {
      await save(values, version);
      setConflict(null);
      return true;
    } catch (err) {
      if (isApiError(err) && err.code === "version_conflict" && err.conflict) {
        setConflict({ current: err.conflict.current as T, changedBy: err.conflict.changedBy, changedAt: err.conflict.changedAt });
        return false;
      }
      throw err;
    }
  };
  return {
    version: opened.version,
    conflict,
    /** Saves with the version the form was opened at; false when someone saved first (see `conflict`). */
    submit: (values: V) => run(values, opened.version),
    /** Saves what the user typed over the other person's change. */
    saveAgain: async () => {
      if (!conflict || last === null) return false;
      const version = conflict.current.version;
      setOpened({ id: record, version });
      setConflict(null);
      return run(last, version);
    },
    /** Takes the other person's record: the caller resets the form to `current`. */
    reload: () => {
      if (!conflict) return null;
      const { current } = conflict;
      setOpened({ id: record, version: current.version });
      setConflict(null);
      return current;
    },
  };
}
