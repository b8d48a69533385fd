import { inArray } from "drizzle-orm";
import type { Db } from "../../db/client";
import { materials } from "../../db/schema";
import { LAYER_KIND_LABELS, type LayerKind } from "../../../shared/domain/layers";
import { mixComponentWords } from "../../../shared/domain/mix-words";

type AuditLayer = {
  kind: string;
  name: string;
  coats: number;
  components: { label: string; materialId: number; parts?: number | null; percent?: number | null; percentOf?: readonly string[] | null }[];
};

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/**
 * What the audit keeps of a plan version, in words a person reads: each layer with its coats and its mix by stock
 * number and name, e.g. 'Clear "Gloss clear", 2 coats: clear S5-B02 2K urethane clear 4 parts, reducer S6-B02 …'.
 * Names are copied in, so the record stays true when the catalogue changes later.
 */
export function planAuditSummary(db: Pick<Db, "select">, name: string, version: number, layers: readonly AuditLayer[]) {
  const ids = [...new Set(layers.flatMap((l) => l.components.map((c) => c.materialId)))];
  const rows = ids.length ? db.select({ id: materials.id, code: materials.code, name: materials.name }).from(materials).where(inArray(materials.id, ids)).all() : [];
  const byId = new Map(rows.map((m) => [m.id, m]));
  return {
    name,
    version,
    layers: layers.map((l) => {
      const kind = LAYER_KIND_LABELS[l.kind as LayerKind] ?? l.kind;
      const head = `${kind}${l.name && l.name !== kind ? ` "${l.name}"` : ""}, ${plural(l.coats, "coat", "coats")}`;
      const words = mixComponentWords(
        l.components.map((c) => ({
          label: c.label,
          materialCode: byId.get(c.materialId)?.code ?? `material ${c.materialId}`,
          materialName: byId.get(c.materialId)?.name ?? "",
          parts: c.parts ?? null,
          percent: c.percent ?? null,
          percentOf: c.percentOf ?? null,
        })),
      );
      return words.length ? `${head}: ${words.map((w) => `${w.label} ${w.material} ${w.amount}`).join(", ")}` : head;
    }),
  };
}
