// Tests run outside React Server Components; "server-only" is a no-op here.
export {};
