/**
 * The glossary: every word Loopshift prints for a status, a stage, a scenario, a sensitivity
 * driver, a role, a finance figure or a workbook sheet, written once. Screens, the workbook, the
 * dossier and the e-mails read their words from here, so that one thing has one name wherever a
 * customer meets it.
 *
 * Spelling: British English throughout ("Labour", "colour", "modelled", "catalogue"). Keys stay as
 * the database and the engine store them; only the labels here reach a reader.
 *
 * Pure TypeScript: no database, no server code, so that every layer may import it. The field
 * labels of axis, motor, drive, duty, motion and kit inputs live in the field registry instead.
 */
export * from "./stages";
export * from "./statuses";
export * from "./scenarios";
export * from "./drivers";
export * from "./finance";
export * from "./roles";
export * from "./sheets";
export * from "./kinds";
