// Stand-in for the "server-only" guard when vitest imports server modules directly.
export {};
