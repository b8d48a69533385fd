export * from "./types";
export * from "./timing";
export * from "./hours";
export * from "./conflicts";
export * from "./suggest";
