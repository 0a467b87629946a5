/** Post-sign-in destinations: only same-site absolute paths, never `//host` or a full URL. */
export function safeCallbackPath(value: unknown, fallback = "/app"): string {
  if (typeof value !== "string" || !value.startsWith("/") || value.startsWith("//") || value.startsWith("/\\")) {
    return fallback;
  }
  return value;
}
