/** One-line structured-ish logging for the worker process (stdout/stderr). */
export function log(message: string, error?: unknown): void {
  const line = `[worker ${process.pid}] ${new Date().toISOString()} ${message}`;
  if (error === undefined) console.log(line);
  else console.error(line, error instanceof Error ? error.message : error);
}
