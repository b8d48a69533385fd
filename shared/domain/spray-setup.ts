/**
 * How a coat or a test panel was sprayed: the set-up a painter needs to repeat a candy years later. Lengths and
 * pressures are kept as entered with their unit (a shop reads its own gauges); these helpers convert for comparing.
 */

export const PRESSURE_UNITS = ["psi", "bar"] as const;
export type PressureUnit = (typeof PRESSURE_UNITS)[number];
export const LENGTH_UNITS = ["cm", "in"] as const;
export type LengthUnit = (typeof LENGTH_UNITS)[number];

/** 1 psi = 6.894757 kPa and 1 bar = 100 kPa (NIST SP 811, appendix B), so 1 bar ≈ 14.5038 psi. */
export const PSI_PER_BAR = 100 / 6.894757293168361;
/** 1 in = 2.54 cm exactly (international inch). */
export const CM_PER_IN = 2.54;

export const toPsi = (value: number, unit: PressureUnit) => (unit === "psi" ? value : value * PSI_PER_BAR);
export const toCm = (value: number, unit: LengthUnit) => (unit === "cm" ? value : value * CM_PER_IN);

/**
 * Limits a real set-up stays within (common practice: inlet pressures of spray guns up to about 60 psi, 4 bar;
 * a gun held 10–30 cm, 4–12 in, from the part; fans up to about 40 cm, 16 in). Wider than practice, to catch slips.
 */
export const SETUP_LIMITS = {
  tipMm: { min: 0.2, max: 4 },
  pressure: { psi: { min: 1, max: 100 }, bar: { min: 0.1, max: 7 } },
  distance: { cm: { min: 3, max: 60 }, in: { min: 1, max: 24 } },
  fanWidth: { cm: { min: 2, max: 60 }, in: { min: 1, max: 24 } },
} as const;

/** The lights a panel is photographed and read under: colours that match under one light can differ under another. */
export const PANEL_LIGHTS = ["daylight", "booth", "warm_indoor"] as const;
export type PanelLight = (typeof PANEL_LIGHTS)[number];
export const PANEL_LIGHT_LABELS: Record<PanelLight, string> = {
  daylight: "Daylight",
  booth: "Booth light",
  warm_indoor: "Warm indoor light",
};

/**
 * CIE standard illuminants a colour meter reports under (CIE 15:2018): D65 and D50 daylight, A incandescent
 * (2856 K), F2 cool-white and F11 narrow-band fluorescent, LED-B3 a white LED.
 */
export const ILLUMINANTS = ["D65", "D50", "A", "F2", "F11", "LED-B3"] as const;
export type Illuminant = (typeof ILLUMINANTS)[number];
/** The illuminant a meter would usually be set to for each light (the user may pick another). */
export const DEFAULT_ILLUMINANT: Record<PanelLight, Illuminant> = { daylight: "D65", booth: "F11", warm_indoor: "A" };

export type SpraySetup = {
  gunId: number | null;
  tipMm: number | null;
  inletPressure: number | null;
  pressureUnit: PressureUnit | null;
  distance: number | null;
  fanWidth: number | null;
  distanceUnit: LengthUnit | null;
  overlapPct: number | null;
};

export const EMPTY_SETUP: SpraySetup = {
  gunId: null,
  tipMm: null,
  inletPressure: null,
  pressureUnit: null,
  distance: null,
  fanWidth: null,
  distanceUnit: null,
  overlapPct: null,
};

const fmt = (n: number) => String(Number(n.toFixed(2)));

/** "Gun 2 · 1.3 mm tip · 26 psi · 15 cm · fan 25 cm · 50 % overlap", leaving out what was not recorded. */
export function describeSetup(s: SpraySetup, gunName: string | null): string {
  const parts: string[] = [];
  if (gunName) parts.push(gunName);
  if (s.tipMm != null) parts.push(`${fmt(s.tipMm)} mm tip`);
  if (s.inletPressure != null && s.pressureUnit) parts.push(`${fmt(s.inletPressure)} ${s.pressureUnit} at the inlet`);
  if (s.distance != null && s.distanceUnit) parts.push(`${fmt(s.distance)} ${s.distanceUnit} from the part`);
  if (s.fanWidth != null && s.distanceUnit) parts.push(`fan ${fmt(s.fanWidth)} ${s.distanceUnit}`);
  if (s.overlapPct != null) parts.push(`${fmt(s.overlapPct)} % overlap`);
  return parts.join(" · ");
}

/** True when nothing of the set-up was recorded. */
export const setupIsEmpty = (s: SpraySetup) => Object.values(s).every((v) => v == null);
