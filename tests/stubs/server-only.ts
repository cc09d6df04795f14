// Test stand-in for the "server-only" guard, which only resolves inside the React server build.
export {};
