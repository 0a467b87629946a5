/** Password hashing with bcrypt (bcryptjs, cost 12 — common practice for interactive logins). */
import bcrypt from "bcryptjs";

const COST = 12;
/** A valid hash of a random string: compared when the user is unknown, so timing does not reveal it. */
const DUMMY_HASH = "$2b$12$JsX6eqEFrWGMTl2ZyqrHaum85MR5IGV9CBlwfZmOL9tkCUBSzEao2";

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, COST);
}

/** Compares against `hash`, or against a dummy hash when there is none (always false then). */
export async function verifyPassword(
  password: string,
  hash: string | null | undefined,
): Promise<boolean> {
  const ok = await bcrypt.compare(password, hash ?? DUMMY_HASH);
  return ok && Boolean(hash);
}
