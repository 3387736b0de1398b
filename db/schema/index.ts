export * from "./users";
export * from "./accounts";
export * from "./audit";
export * from "./catalogue";
export * from "./installed-base";
export * from "./imports";
export * from "./cases";
export * from "./dossiers";
