import { converter, formatHex } from "culori";
import type { PanelDto } from "@shared/schemas/panel.schema";
import { cn } from "@/utils/cn";

const toRgb = converter("rgb");

/** An on-screen colour for a CIELAB (D65) reading; screens only approximate a sprayed panel. */
export function labToHex(lab: { L: number; a: number; b: number }): string {
  const c = toRgb({ mode: "lab65", l: lab.L, a: lab.a, b: lab.b });
  const clamp = (v: number) => Math.min(1, Math.max(0, v));
  return formatHex({ mode: "rgb", r: clamp(c.r), g: clamp(c.g), b: clamp(c.b) });
}

/** The panel's photo, else a patch coloured from its meter reading, else a plain placeholder. */
export function PanelSwatch({ panel, className }: { panel: PanelDto; className?: string }) {
  if (panel.photo) {
    return <img src={panel.photo.thumbUrl ?? panel.photo.url} alt={`Photo of ${panel.label}`} className={cn("aspect-square w-full rounded-lg border border-primer-300 object-cover", className)} loading="lazy" />;
  }
  if (panel.lab) {
    return (
      <div
        role="img"
        aria-label={`Colour from the meter reading of ${panel.label} (approximate on screen)`}
        className={cn("aspect-square w-full rounded-lg border border-primer-300", className)}
        style={{ background: labToHex(panel.lab) }}
      />
    );
  }
  return (
    <div role="img" aria-label={`No photo or reading for ${panel.label}`} className={cn("grid aspect-square w-full place-items-center rounded-lg border border-dashed border-primer-400 bg-primer-100 text-sm text-primer-700", className)}>
      No photo
    </div>
  );
}

export const formatLab = (lab: { L: number; a: number; b: number } | null) => (lab ? `L* ${lab.L.toFixed(1)}  a* ${lab.a.toFixed(1)}  b* ${lab.b.toFixed(1)}` : "No reading");
