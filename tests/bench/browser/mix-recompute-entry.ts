/**
 * Bundled for the browser by tests/bench/mix-recompute.ts: what the mix-sheet dialog and the Mix calculator do on
 * every keystroke, through the shared engine (parts and percentages, amounts, scale weights, rounding, mixed VOC).
 */
import { computeMix, mixVoc, resolveShares, type MixComponent } from "../../../shared/mix/index";

const COMPONENTS: MixComponent[] = [
  { name: "clear", parts: 4, densityGPerMl: 0.98 },
  { name: "hardener", parts: 1, densityGPerMl: 1.08 },
  { name: "reducer", percent: 10, percentOf: ["clear", "hardener"], densityGPerMl: 0.87 },
  { name: "toner", percent: 5, percentOf: "clear", densityGPerMl: 1.02 },
];
const VOC = { clear: [420, 0], hardener: [380, 0], reducer: [860, 0], toner: [600, 5] } as Record<string, [number, number]>;

/** One recomputation for `amount` mL, as the painter types it. */
function recompute(amount: number) {
  const result = computeMix({ components: COMPONENTS, mode: "total", amount, unit: "mL", rounding: { step: 5, unit: "g" } });
  const shares = resolveShares(COMPONENTS);
  const voc = mixVoc(shares.map((s) => ({ volume: s.share, vocGPerL: VOC[s.name]![0], waterExemptPct: VOC[s.name]![1] })));
  return result.lines.length + (result.rounded?.lines.length ?? 0) + voc;
}

/** Runs `n` recomputations with changing amounts; returns each one's time in ms. */
(window as unknown as { __recompute: (n: number) => number[] }).__recompute = (n: number) => {
  const times: number[] = [];
  let sink = 0;
  for (let i = 0; i < n; i++) {
    const t = performance.now();
    sink += recompute(100 + (i % 900));
    times.push(performance.now() - t);
  }
  if (sink === -1) console.log(sink);
  return times;
};
