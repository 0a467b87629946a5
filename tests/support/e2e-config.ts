/** Where the e2e app server listens; browse on localhost (Auth.js compares hosts). */
export const E2E_PORT = Number(process.env.E2E_PORT ?? 3100);
export const E2E_URL = `http://localhost:${E2E_PORT}`;
