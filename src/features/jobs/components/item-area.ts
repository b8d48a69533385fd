import { AREA_UNIT_LABELS, type AreaUnit } from "@shared/domain/substrates";

const areaFormat = new Intl.NumberFormat(undefined, { maximumFractionDigits: 2 });

/** "0.6 m²" */
export function formatArea(value: number, unit: AreaUnit): string {
  return `${areaFormat.format(value)} ${AREA_UNIT_LABELS[unit]}`;
}
