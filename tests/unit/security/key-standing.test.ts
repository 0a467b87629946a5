/** The lower of key role and creator role (common practice: a delegated credential never outranks its delegator). */
import { describe, expect, it } from "vitest";
import { describeStanding, keyStanding } from "@/lib/api-keys/effective-role";
import { ROLES, roleAtLeast, type Role } from "@/lib/orgs/roles";

const KEY_ROLES: Role[] = ["viewer", "member", "admin"];

describe("keyStanding", () => {
  it("is the lower of the two roles for every pair, and disabled without a creator", () => {
    for (const keyRole of KEY_ROLES) {
      expect(keyStanding(keyRole, null)).toEqual({ state: "disabled", keyRole });
      for (const creator of ROLES) {
        const s = keyStanding(keyRole, creator);
        const lower = roleAtLeast(creator, keyRole) ? keyRole : creator;
        expect(s.state === "disabled" ? null : s.role).toBe(lower);
        expect(s.state).toBe(lower === keyRole ? "full" : "capped");
      }
    }
  });

  it("explains a capped and a disabled key in one sentence", () => {
    expect(describeStanding(keyStanding("member", "member"))).toBeNull();
    expect(describeStanding(keyStanding("admin", "viewer"))).toMatch(
      /Acts as Viewer.*below the key's Admin/,
    );
    expect(describeStanding(keyStanding("member", null))).toMatch(/no longer a member/);
  });
});
