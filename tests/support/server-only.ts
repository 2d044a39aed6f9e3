// Stands in for the 'server-only' marker package outside Next.js (vitest).
export {};
