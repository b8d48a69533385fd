import { convertFilm, convertPressure, FILM_UNIT_LABELS, type FilmUnit, type PressureUnit } from "@shared/domain/measures";
import { formatNumber } from "./format-quantity";

/** A pressure stored in psi, shown in the shop's unit: "29 psi" or "2 bar". */
export function formatPressure(psi: number, unit: PressureUnit): string {
  return unit === "psi" ? `${formatNumber(psi, 1)} psi` : `${formatNumber(convertPressure(psi, "psi", "bar"), 2)} bar`;
}

/** A film thickness in the unit it was given, shown in the shop's unit: "2 mil" → "50.8 µm". */
export function formatFilm(value: number, from: FilmUnit, to: FilmUnit): string {
  return `${formatNumber(convertFilm(value, from, to), to === "um" ? 1 : 2)} ${FILM_UNIT_LABELS[to]}`;
}
