/**
 * What an API key may do right now: the lower of the key's own role and its
 * creator's CURRENT role in the key's organisation, decided on every request.
 * A creator who was demoted caps the key at their new role; a creator who is
 * no longer a member (removed, left, or deleted) disables the key. Client-safe
 * (the API-keys page shows the same verdict).
 */
import { ROLE_LABELS, roleAtLeast, type Role } from "@/lib/orgs/roles";

export type KeyStanding =
  | { state: "full"; role: Role }
  | { state: "capped"; role: Role; keyRole: Role; creatorRole: Role }
  | { state: "disabled"; keyRole: Role };

export function keyStanding(keyRole: Role, creatorRole: Role | null): KeyStanding {
  if (!creatorRole) return { state: "disabled", keyRole };
  if (roleAtLeast(creatorRole, keyRole)) return { state: "full", role: keyRole };
  return { state: "capped", role: creatorRole, keyRole, creatorRole };
}

/** One sentence for the API-keys page and for 403 answers. */
export function describeStanding(standing: KeyStanding): string | null {
  switch (standing.state) {
    case "full":
      return null;
    case "capped":
      return `Acts as ${ROLE_LABELS[standing.role]}: its creator's role is now ${ROLE_LABELS[standing.creatorRole]}, below the key's ${ROLE_LABELS[standing.keyRole]}.`;
    case "disabled":
      return "Disabled: the person who created it is no longer a member of this organisation.";
  }
}
