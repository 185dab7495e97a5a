// The names and labels every layer shares, from the browser to the models. A leaf: it imports
// nothing of ours, so anything may import it without making a cycle.
export * from "./boards";
export * from "./chemistries";
export * from "./confidence";
export * from "./firmware-units";
export * from "./moderation";
export * from "./photos";
export * from "./quantities";
export * from "./roles";
export * from "./statistics";
export * from "./submissions";
export * from "./worksheets";
