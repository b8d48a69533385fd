import { useState, type ChangeEvent } from "react";
import { Crosshair } from "lucide-react";
import { describeSetup, type LengthUnit, type PressureUnit } from "@shared/domain/spray-setup";
import type { BoothDto } from "@shared/schemas/booth.schema";
import type { SpraySetupDto } from "@shared/schemas/spray-setup.schema";
import { Button } from "@/components/ui/button";
import { SelectField } from "@/components/ui/form/select-field";
import { TextField } from "@/components/ui/form/text-field";
import { cn } from "@/utils/cn";

/** The set-up fields of the log-a-coat form, as typed (strings; the shared schema parses them). */
export type SetupFields = {
  gunId: string;
  tipMm: string;
  inletPressure: string;
  pressureUnit: PressureUnit;
  distance: string;
  fanWidth: string;
  distanceUnit: LengthUnit;
  overlapPct: string;
};
export const SETUP_FIELD_NAMES = ["gunId", "tipMm", "inletPressure", "pressureUnit", "distance", "fanWidth", "distanceUnit", "overlapPct"] as const;

const text = (n: number | null) => (n == null ? "" : String(n));

/**
 * What the coat form starts from: the set-up of the last coat of this layer (the painter keeps the gun as it was),
 * else the approved panel's when this layer is the one the panel was sprayed for (or a candy), else nothing.
 */
export function setupPrefill(card: BoothDto, layerId: number, layerKind: string, defaultPressure: "psi" | "bar" = "psi"): { fields: SetupFields; target: SpraySetupDto | null } {
  const panel = card.job.approvedPanel;
  const target = panel && panel.setup.summary && (panel.planLayerId === layerId || (panel.planLayerId == null && layerKind === "candy")) ? panel.setup : null;
  const lastOfLayer = card.coatLogs.filter((c) => c.layerId === layerId && c.status !== "voided" && c.setup.summary).at(-1)?.setup;
  const from = lastOfLayer ?? target;
  return {
    target,
    fields: {
      gunId: from?.gunId != null ? String(from.gunId) : "",
      tipMm: text(from?.tipMm ?? null),
      inletPressure: text(from?.inletPressure ?? null),
      pressureUnit: from?.pressureUnit ?? defaultPressure,
      distance: text(from?.distance ?? null),
      fanWidth: text(from?.fanWidth ?? null),
      distanceUnit: from?.distanceUnit ?? "in",
      overlapPct: text(from?.overlapPct ?? null),
    },
  };
}

const num = (v: string) => (v.trim() === "" || !Number.isFinite(Number(v)) ? null : Number(v));

/** Two big toggle buttons for a unit (no hover, thumb-sized). */
function UnitToggle<U extends string>({ name, legend, units, value, onChange }: { name: string; legend: string; units: readonly U[]; value: U; onChange: (u: U) => void }) {
  return (
    <fieldset className="flex gap-1.5">
      <legend className="sr-only">{legend}</legend>
      {units.map((u) => (
        <label
          key={u}
          className={cn(
            "grid min-h-12 w-14 cursor-pointer place-items-center rounded-lg border-2 text-base font-semibold has-focus-visible:outline-3 has-focus-visible:outline-offset-2 has-focus-visible:outline-candy-600",
            value === u ? "border-ink-900 bg-ink-900 text-white" : "border-primer-400 bg-white text-ink-950",
          )}
        >
          <input type="radio" name={name} value={u} className="sr-only" checked={value === u} onChange={() => onChange(u)} />
          {u}
        </label>
      ))}
    </fieldset>
  );
}

/**
 * The gun set-up of the coat being logged: the approved panel's set-up as the target, what this coat uses in one
 * line, and the fields to change it (opened with a tap, so the log button stays near the top).
 */
export function SpraySetupPanel({
  guns,
  target,
  values,
  errors,
  set,
}: {
  guns: BoothDto["guns"];
  target: SpraySetupDto | null;
  values: SetupFields;
  errors: Partial<Record<keyof SetupFields, string>>;
  set: <K extends keyof SetupFields>(field: K, value: SetupFields[K]) => void;
}) {
  const hasError = SETUP_FIELD_NAMES.some((f) => errors[f]);
  const [open, setOpen] = useState(false);
  const gunName = guns.find((g) => String(g.id) === values.gunId)?.name ?? null;
  const current = describeSetup(
    {
      gunId: num(values.gunId),
      tipMm: num(values.tipMm),
      inletPressure: num(values.inletPressure),
      pressureUnit: values.pressureUnit,
      distance: num(values.distance),
      fanWidth: num(values.fanWidth),
      distanceUnit: values.distanceUnit,
      overlapPct: num(values.overlapPct),
    },
    gunName,
  );
  const field = (name: "tipMm" | "inletPressure" | "distance" | "fanWidth" | "overlapPct") => ({
    name,
    value: values[name],
    inputMode: "decimal" as const,
    autoComplete: "off",
    className: "min-h-12 text-lg",
    error: errors[name],
    onChange: (e: ChangeEvent<HTMLInputElement>) => set(name, e.target.value),
  });
  return (
    <section aria-labelledby="spray-setup-heading" className="rounded-xl border border-primer-300 bg-primer-50 p-4">
      <h3 id="spray-setup-heading" className="flex items-center gap-2 text-base font-semibold text-ink-950">
        <Crosshair aria-hidden className="size-5" />
        Spray set-up
      </h3>
      {target ? (
        <p className="mt-1 text-base text-ink-950" data-testid="setup-target">
          <span className="font-semibold">Target (approved panel):</span> {target.summary}
        </p>
      ) : null}
      <p className="mt-1 text-base text-ink-950" data-testid="setup-current">
        <span className="font-semibold">This coat:</span> {current || "not recorded"}
      </p>
      {open || hasError ? (
        <div className="mt-3 grid gap-3 sm:grid-cols-2">
          <SelectField label="Gun" name="gunId" value={values.gunId} className="min-h-12 text-lg" error={errors.gunId} onChange={(e) => set("gunId", e.target.value)}>
            <option value="">Not recorded</option>
            {guns.map((g) => (
              <option key={g.id} value={g.id}>
                {g.name}
              </option>
            ))}
          </SelectField>
          <TextField label="Tip (mm)" {...field("tipMm")} />
          <div className="flex items-end gap-2">
            <div className="min-w-0 flex-1">
              <TextField label="Inlet pressure" {...field("inletPressure")} error={errors.inletPressure ?? errors.pressureUnit} />
            </div>
            <UnitToggle name="pressureUnit" legend="Pressure unit" units={["psi", "bar"] as const} value={values.pressureUnit} onChange={(u) => set("pressureUnit", u)} />
          </div>
          <TextField label="Overlap (%)" {...field("overlapPct")} />
          <div className="flex items-end gap-2 sm:col-span-2">
            <div className="grid min-w-0 flex-1 grid-cols-2 gap-2">
              <TextField label="Distance from the part" {...field("distance")} error={errors.distance ?? errors.distanceUnit} />
              <TextField label="Fan width" {...field("fanWidth")} />
            </div>
            <UnitToggle name="distanceUnit" legend="Length unit" units={["cm", "in"] as const} value={values.distanceUnit} onChange={(u) => set("distanceUnit", u)} />
          </div>
        </div>
      ) : (
        <Button variant="secondary" size="lg" className="mt-3" onClick={() => setOpen(true)}>
          Change the set-up for this coat…
        </Button>
      )}
    </section>
  );
}
