/** Booth temperature units: a reading is kept as entered, with its unit. */
export const TEMP_UNITS = ["C", "F"] as const;
export type TempUnit = (typeof TEMP_UNITS)[number];

/** °F → °C and back (exact linear definitions: °C = (°F − 32) × 5/9). */
export const fToC = (f: number) => ((f - 32) * 5) / 9;
export const cToF = (c: number) => (c * 9) / 5 + 32;
export const toCelsius = (value: number, unit: TempUnit) => (unit === "C" ? value : fToC(value));
