export * from "./states";
export * from "./roles";
export * from "./pieces";
export * from "./moves";
export * from "./can-move";
export * from "./schemas";
