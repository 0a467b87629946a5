/**
 * Sign-up and password sign-in against the real database and Redis: the user,
 * the personal organisation with the user as owner, the bcrypt hash, and the
 * bad inputs (taken e-mail, weak password, malformed e-mail, wrong password
 * with no user enumeration).
 */
import bcrypt from "bcryptjs";
import { eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db";
import { users } from "@/db/schema";
import { isProblemError } from "@/lib/api/problem";
import { authorizeWithPassword } from "@/lib/auth/config";
import { UnverifiedEmailSignIn } from "@/lib/auth/errors";
import { signUpSchema } from "@/lib/auth/schemas";
import { signUp, TAKEN_EMAIL_MESSAGE } from "@/lib/auth/sign-up";
import { listMembershipsForUser } from "@/lib/orgs/queries";
import { closeRedis } from "@/lib/rate-limit/redis";
import { uniqueEmail } from "../../support/factories";

afterAll(async () => {
  await closeRedis();
  await closeDb();
});

const request = (ip: string) =>
  new Request("http://localhost/api/auth/callback/credentials", {
    headers: { "x-forwarded-for": ip },
  });

describe("signUp", () => {
  it("creates the user with a bcrypt hash and a personal organisation they own", async () => {
    const input = signUpSchema.parse({
      name: "Ada Quant",
      email: uniqueEmail("ada").toUpperCase(),
      password: "entangled photons",
    });
    const { userId, orgId } = await signUp(input);
    const [row] = await db.select().from(users).where(eq(users.id, userId));
    expect(row.email).toBe(input.email.toLowerCase());
    expect(row.passwordHash).toMatch(/^\$2[aby]\$12\$/); // bcrypt modular crypt format, cost 12
    expect(await bcrypt.compare("entangled photons", row.passwordHash!)).toBe(true);
    const memberships = await listMembershipsForUser(userId);
    expect(memberships).toHaveLength(1);
    expect(memberships[0]).toMatchObject({
      role: "owner",
      org: { id: orgId, name: "Ada Quant's organisation", plan: "sandbox" },
    });
  });

  it("refuses a taken e-mail (any letter case) with 409 and a field error", async () => {
    const email = uniqueEmail("taken");
    await signUp(signUpSchema.parse({ name: "First", email, password: "first password ok" }));
    const again = signUpSchema.parse({
      name: "Second",
      email: email.toUpperCase(),
      password: "second password ok",
    });
    const error = await signUp(again).catch((e: unknown) => e);
    expect(isProblemError(error)).toBe(true);
    if (!isProblemError(error)) return;
    expect(error.status).toBe(409);
    expect(error.problem.errors).toEqual([{ path: "email", message: TAKEN_EMAIL_MESSAGE }]);
  });

  it.each([
    ["short", "short1", "Use at least 10 characters."],
    ["one repeated character", "aaaaaaaaaaaa", "Don't use one character repeated."],
    ["common", "Password123", "That password is too common; choose another."],
  ])("rejects a weak password (%s)", (_label, password, message) => {
    const result = signUpSchema.safeParse({ name: "W", email: uniqueEmail(), password });
    expect(result.success).toBe(false);
    expect(result.error?.issues.map((i) => i.message)).toContain(message);
  });

  it.each(["not-an-email", "two@@example.org", "", "spaces in@example.org"])(
    "rejects the malformed e-mail %j",
    (email) => {
      const result = signUpSchema.safeParse({ name: "M", email, password: "long enough pass" });
      expect(result.success).toBe(false);
      expect(result.error?.issues[0].path).toEqual(["email"]);
    },
  );
});

describe("password sign-in (Credentials authorize)", () => {
  it("accepts the right password and answers null for a wrong one or an unknown e-mail", async () => {
    const email = uniqueEmail("signin");
    await signUp(signUpSchema.parse({ name: "Sig", email, password: "right password here" }), {
      verified: true,
    });
    const ok = await authorizeWithPassword(
      { email, password: "right password here" },
      request("10.9.0.1"),
    );
    expect(ok).toMatchObject({ email });
    expect(
      await authorizeWithPassword({ email, password: "wrong password here" }, request("10.9.0.1")),
    ).toBeNull();
    expect(
      await authorizeWithPassword(
        { email: uniqueEmail("nobody"), password: "whatever pass" },
        request("10.9.0.1"),
      ),
    ).toBeNull();
    expect(
      await authorizeWithPassword({ email: "not an email", password: "x" }, request("10.9.0.1")),
    ).toBeNull();
  });

  it("refuses the right password until the address is confirmed, and says so only to who knows it", async () => {
    const email = uniqueEmail("unconfirmed");
    const { userId } = await signUp(
      signUpSchema.parse({ name: "Unc", email, password: "right password here" }),
    );
    const refused = await authorizeWithPassword(
      { email, password: "right password here" },
      request("10.9.0.2"),
    ).catch((e: unknown) => e);
    expect(refused).toBeInstanceOf(UnverifiedEmailSignIn);
    // a wrong password tells nothing about the account's state
    expect(
      await authorizeWithPassword({ email, password: "wrong password here" }, request("10.9.0.2")),
    ).toBeNull();
    // using the e-mailed link sets emailVerified (Auth.js e-mail sign-in); then the password works
    await db.update(users).set({ emailVerified: new Date() }).where(eq(users.id, userId));
    expect(
      await authorizeWithPassword({ email, password: "right password here" }, request("10.9.0.2")),
    ).toMatchObject({ email });
  });
});
