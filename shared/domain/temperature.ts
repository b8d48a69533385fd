/** Booth temperature units: a reading is kept as entered, with its unit. */
export const TEMP_UNITS = ["C", "F"] as const;
export type TempUnit = (typeof TEMP_UNITS)[number];

/** °F → °C and back (exact linear definitions: °C = (°F − 32) × 5/9). */
export const fToC = (f: number) => ((f - 32) * 5) / 9;
export const cToF = (c: number) => (c * 9) / 5 + 32;
export const toCelsius = (value: number, unit: TempUnit) => (unit === "C" ? value : fToC(value));

/**
 * A temperature typed in a form, re-expressed when the unit switches: "21" °C → "70" °F. Booth thermometers read whole
 * degrees (common practice), so the result is rounded to one; text that is not a number is left as typed.
 */
export function switchTemperatureText(text: string, from: TempUnit, to: TempUnit): string {
  const value = Number(text.trim().replace(",", "."));
  if (from === to || text.trim() === "" || !Number.isFinite(value)) return text;
  return String(Math.round(to === "F" ? cToF(value) : fToC(value)));
}
