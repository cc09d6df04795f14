/**
 * The public API of the computation. Everything the app shows or signs about a head's geometry
 * comes from here. Pure TypeScript: no framework, database or file-system imports.
 */
export * from "./errors";
export * from "./units";
export * from "./types";
export * from "./csv";
export * from "./circle";
export * from "./tram";
export * from "./sweep";
export * from "./multi-point";
export * from "./angle";
export * from "./decision";
export * from "./test-part";
export * from "./positioning";
export * from "./rotary-positioning";
export * from "./tcp-check";
export * from "./budget";
export * from "./lm";
export * from "./head/config";
export * from "./head/model";
export * from "./head/identifiability";
export * from "./head/fit";
export * from "./head/plan";
export * from "./head/synth";
export * from "./version";
