import { AsyncLocalStorage } from "node:async_hooks";

// Next.js's request scope is an AsyncLocalStorage that its server puts on globalThis before
// loading any app code; tests that run handlers in-process do the same, first.
(globalThis as { AsyncLocalStorage?: unknown }).AsyncLocalStorage ??= AsyncLocalStorage;
