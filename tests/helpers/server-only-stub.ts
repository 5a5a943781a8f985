// vitest runs server modules directly; the real 'server-only' package throws outside a React server build.
export {};
