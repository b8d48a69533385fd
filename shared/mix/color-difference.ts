import { MixError, requirePositive } from "./errors";

/** A CIELAB colour: L* (lightness), a* (green–red), b* (blue–yellow). */
export interface Lab {
  L: number;
  a: number;
  b: number;
}

/** Parametric weights of CIEDE2000; all 1 for the reference conditions. */
export interface DeltaE2000Weights {
  kL?: number;
  kC?: number;
  kH?: number;
}

function checkLab(lab: Lab, field: string): void {
  for (const key of ["L", "a", "b"] as const) {
    const v = lab?.[key];
    if (typeof v !== "number" || !Number.isFinite(v)) {
      throw new MixError(`${field}.${key}: must be a finite number (got ${String(v)})`, { field: `${field}.${key}` });
    }
  }
}

/** CIE 1976 colour difference: straight-line distance in L*a*b*. */
export function deltaE76(lab1: Lab, lab2: Lab): number {
  checkLab(lab1, "lab1");
  checkLab(lab2, "lab2");
  return Math.hypot(lab2.L - lab1.L, lab2.a - lab1.a, lab2.b - lab1.b);
}

const RAD = Math.PI / 180;
const POW25_7 = 25 ** 7;

/** Hue angle in degrees, [0, 360); 0 for a neutral colour. */
function hueDeg(a: number, b: number): number {
  if (a === 0 && b === 0) return 0;
  const h = Math.atan2(b, a) / RAD;
  return h < 0 ? h + 360 : h;
}

/**
 * CIEDE2000 colour difference, following the implementation notes of Sharma, Wu and Dalal (2005),
 * including their conventions for the hue difference and mean hue of neutral colours and the
 * ±180° wrap.
 */
export function deltaE2000(lab1: Lab, lab2: Lab, weights: DeltaE2000Weights = {}): number {
  checkLab(lab1, "lab1");
  checkLab(lab2, "lab2");
  const kL = requirePositive(weights.kL ?? 1, "kL");
  const kC = requirePositive(weights.kC ?? 1, "kC");
  const kH = requirePositive(weights.kH ?? 1, "kH");

  // 1. Chroma-dependent stretch of a* (G) so near-neutral colours are handled better.
  const c1 = Math.hypot(lab1.a, lab1.b);
  const c2 = Math.hypot(lab2.a, lab2.b);
  const cBar7 = ((c1 + c2) / 2) ** 7;
  const g = 0.5 * (1 - Math.sqrt(cBar7 / (cBar7 + POW25_7)));
  const a1p = (1 + g) * lab1.a;
  const a2p = (1 + g) * lab2.a;
  const c1p = Math.hypot(a1p, lab1.b);
  const c2p = Math.hypot(a2p, lab2.b);
  const h1p = hueDeg(a1p, lab1.b);
  const h2p = hueDeg(a2p, lab2.b);

  // 2. Differences in lightness, chroma and hue.
  const dLp = lab2.L - lab1.L;
  const dCp = c2p - c1p;
  let dhp = 0;
  if (c1p * c2p !== 0) {
    dhp = h2p - h1p;
    if (dhp > 180) dhp -= 360;
    else if (dhp < -180) dhp += 360;
  }
  const dHp = 2 * Math.sqrt(c1p * c2p) * Math.sin((dhp / 2) * RAD);

  // 3. Means, weighting functions and the rotation term.
  const lBarP = (lab1.L + lab2.L) / 2;
  const cBarP = (c1p + c2p) / 2;
  let hBarP = h1p + h2p;
  if (c1p * c2p !== 0) {
    if (Math.abs(h1p - h2p) <= 180) hBarP = (h1p + h2p) / 2;
    else hBarP = h1p + h2p < 360 ? (h1p + h2p + 360) / 2 : (h1p + h2p - 360) / 2;
  }
  const t =
    1 -
    0.17 * Math.cos((hBarP - 30) * RAD) +
    0.24 * Math.cos(2 * hBarP * RAD) +
    0.32 * Math.cos((3 * hBarP + 6) * RAD) -
    0.2 * Math.cos((4 * hBarP - 63) * RAD);
  const dTheta = 30 * Math.exp(-(((hBarP - 275) / 25) ** 2));
  const cBarP7 = cBarP ** 7;
  const rC = 2 * Math.sqrt(cBarP7 / (cBarP7 + POW25_7));
  const lOff = (lBarP - 50) ** 2;
  const sL = 1 + (0.015 * lOff) / Math.sqrt(20 + lOff);
  const sC = 1 + 0.045 * cBarP;
  const sH = 1 + 0.015 * cBarP * t;
  const rT = -Math.sin(2 * dTheta * RAD) * rC;

  const l = dLp / (kL * sL);
  const c = dCp / (kC * sC);
  const h = dHp / (kH * sH);
  return Math.sqrt(l * l + c * c + h * h + rT * c * h);
}
