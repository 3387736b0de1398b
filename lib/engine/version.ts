/** Version of the model in ENGINE.md that this code implements; every CaseResult carries it. */
export const ENGINE_VERSION = "2.0.0";
