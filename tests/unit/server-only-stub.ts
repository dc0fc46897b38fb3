// Vitest runs server modules outside Next; the real "server-only" package throws there.
export {};
