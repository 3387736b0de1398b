// Stands in for the "server-only" guard where server modules run outside Next.js: in vitest and
// in the esbuild-bundled benchmark (the guard throws outside a React Server Component bundle).
export {};
