// Vitest runs outside React's server condition; the real package would throw there.
export {};
