/**
 * Secret-key authentication as the provider does it: `Authorization: Bearer
 * sk_test_…` (or HTTP Basic with the key as user name, as curl `-u` sends).
 * A missing or malformed key is a 401 `invalid_request_error`. This fake is
 * test mode only, so live keys are refused too.
 */
import type { IncomingMessage } from "node:http";
import { ApiError } from "../core/errors";

const KEY_FORMAT = /^(sk|rk)_test_[A-Za-z0-9_]{4,247}$/;

export function authenticate(req: IncomingMessage, requiredKey: string | null): string {
  const header = req.headers.authorization;
  if (!header) {
    throw new ApiError(
      401,
      "invalid_request_error",
      "You did not provide an API key. Send your secret key in the Authorization header using Bearer auth (Authorization: Bearer sk_test_...).",
    );
  }
  let key: string | null = null;
  const bearer = /^Bearer\s+(\S+)$/i.exec(header);
  const basic = /^Basic\s+(\S+)$/i.exec(header);
  if (bearer) key = bearer[1];
  else if (basic) key = Buffer.from(basic[1], "base64").toString("utf8").split(":")[0];
  if (!key) {
    throw new ApiError(
      401,
      "invalid_request_error",
      "Invalid Authorization header: use Bearer auth with your secret key.",
    );
  }
  if (!KEY_FORMAT.test(key) || (requiredKey !== null && key !== requiredKey)) {
    throw new ApiError(401, "invalid_request_error", `Invalid API Key provided: ${redact(key)}`);
  }
  return key;
}

/** Shows only the prefix and the last four characters, like the provider's messages. */
export function redact(key: string): string {
  const prefix = /^[a-z]+_[a-z]+_/.exec(key)?.[0] ?? "";
  const rest = key.slice(prefix.length);
  return `${prefix}${"*".repeat(Math.max(0, rest.length - 4))}${rest.slice(-4)}`;
}
