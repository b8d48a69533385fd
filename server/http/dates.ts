export const iso = (ms: number) => new Date(ms).toISOString();
export const isoOrNull = (ms: number | null | undefined) => (ms == null ? null : new Date(ms).toISOString());
