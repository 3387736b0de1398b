import type { ParsedAxis } from "./schema";

/** docs/model.md (Torque at speed) drive.resonance and docs/model.md (The business case) reliability.event as the engine parsed them: how db/schema/installed-base.ts stores them. */
export type StoredResonance = NonNullable<ParsedAxis["drive"]["resonance"]>;
export type StoredStepLossEvent = NonNullable<ParsedAxis["reliability"]["event"]>;
