export * from "./users";
export * from "./accounts";
export * from "./audit";
