import { get, set, type FieldErrors, type Resolver } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { planDocumentSchema, type PlanDocument } from "@shared/schemas/plan.schema";
import { mixProblemOf, toDocument, type EditorValues } from "./editor-values";

const schemaResolver = zodResolver(planDocumentSchema);

/**
 * The form holds text as typed; the shared schema checks the document it converts to (toDocument), and its errors come
 * back under the same paths, since the document keeps the form's shape. Then the mix engine checks every layer.
 */
export const planResolver: Resolver<EditorValues, unknown, PlanDocument> = async (values, context, options) => {
  // The same field names: the document keeps the form's paths (layers.0.components.1.parts).
  const documentOptions = options as unknown as Parameters<typeof schemaResolver>[2];
  const result = await schemaResolver(toDocument(values), context, documentOptions);
  const errors: Record<string, unknown> = { ...result.errors };
  values.layers.forEach((l, i) => {
    const problem = mixProblemOf(l.components);
    const path = `layers.${i}.${problem?.path}`;
    // The schema's own message for that field comes first; the mix engine's fills the field only if it has none.
    if (problem && get(errors, path) === undefined) set(errors, path, { type: "mix", message: problem.message });
  });
  if (Object.keys(errors).length) return { values: {}, errors: errors as FieldErrors<EditorValues> };
  return { values: result.values as PlanDocument, errors: {} };
};
