import { LAYER_KIND_LABELS, LAYER_KINDS, type LayerKind } from "@shared/domain/layers";
import { TextField } from "@/components/ui/form/text-field";

type Allowance = { layerKind: LayerKind; pct: number | string };

/**
 * One box per layer kind for the waste allowance added to the estimate; an empty box means none for that kind.
 * The value is the settings' list of { layerKind, pct } (only kinds with a figure).
 */
export function WasteAllowanceFields({ value, onChange, error, disabled }: { value: Allowance[] | undefined; onChange: (v: Allowance[]) => void; error?: string; disabled?: boolean }) {
  const current = new Map((value ?? []).map((a) => [a.layerKind, String(a.pct)]));
  const set = (kind: LayerKind, text: string) => {
    const next = new Map(current);
    if (text.trim() === "") next.delete(kind);
    else next.set(kind, text);
    onChange(LAYER_KINDS.filter((k) => next.has(k)).map((k) => ({ layerKind: k, pct: next.get(k)! })));
  };
  return (
    <div className="flex flex-col gap-2">
      {error ? <p className="text-sm font-medium text-red-800">{error}</p> : null}
      <div className="grid gap-3 sm:grid-cols-3 lg:grid-cols-4">
        {LAYER_KINDS.filter((k) => k !== "prep").map((k) => (
          <TextField key={k} label={`${LAYER_KIND_LABELS[k]} (%)`} inputMode="decimal" disabled={disabled} value={current.get(k) ?? ""} onChange={(e) => set(k, e.target.value)} />
        ))}
      </div>
    </div>
  );
}
