/** Version of the model in ENGINE.md that this code implements; every CaseResult carries it. */
export const ENGINE_VERSION = "1.0.0";
