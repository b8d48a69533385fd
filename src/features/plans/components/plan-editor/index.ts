export { PlanEditor } from "./plan-editor";
export { editorValuesOf, toDocument, type EditorValues } from "./editor-values";
