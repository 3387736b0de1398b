/** Version of the model in docs/model.md that this code implements; every CaseResult carries it. */
export const ENGINE_VERSION = "2.0.0";
