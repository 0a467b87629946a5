/**
 * Sign-up answers the same whether or not the address has an account (the
 * reported hole: "an account with this e-mail already exists" in 6 ms, no
 * rate limit). The owner of an existing address is told by e-mail instead,
 * and sign-ups are rate-limited per address.
 */
import { afterAll, describe, expect, it, vi } from "vitest";
import { closeDb } from "@/db";
import { findUserByEmail } from "@/lib/auth/queries";
import { BUDGETS } from "@/lib/rate-limit";
import { closeRedis } from "@/lib/rate-limit/redis";
import { createTestUser, uniqueEmail } from "../../support/factories";
import { waitForMail } from "../../support/maildev";
import { asBrowser } from "./support/next-context";

vi.mock("next/headers", async () => (await import("./support/next-context")).nextHeadersModule);

afterAll(async () => {
  await closeRedis();
  await closeDb();
});

async function signUpAs(email: string): Promise<{ location: string | null; state: unknown }> {
  const { signUpAction } = await import("@/app/(auth)/sign-up/actions");
  const data = new FormData();
  data.set("name", "Probe Person");
  data.set("email", email);
  data.set("password", "a perfectly fine password");
  asBrowser();
  try {
    return { location: null, state: await signUpAction({ status: "idle" }, data) };
  } catch (error) {
    const digest = (error as { digest?: string }).digest ?? "";
    if (!digest.startsWith("NEXT_REDIRECT")) throw error;
    return { location: digest.split(";")[2], state: null };
  }
}

const shape = (location: string | null, email: string) =>
  location?.replace(encodeURIComponent(email), "<email>");

describe("sign-up without account enumeration", () => {
  it("answers a new and an existing address identically; the existing owner gets a note, the new one a link", async () => {
    const existing = await createTestUser("enum-existing");
    const fresh = uniqueEmail("enum-new");
    const since = new Date();

    const forNew = await signUpAs(fresh);
    const forExisting = await signUpAs(existing.email);
    expect(forNew.state).toBeNull();
    expect(shape(forExisting.location, existing.email)).toBe(shape(forNew.location, fresh));
    expect(forNew.location).toMatch(/^\/check-email\?email=.*&for=sign-up$/);

    expect(await findUserByEmail(fresh)).not.toBeNull();
    const note = await waitForMail(existing.email, since, 20_000, /already have a Ketwise account/);
    expect(note.text).toMatch(/nothing was changed/);
    const link = await waitForMail(fresh, since, 20_000, /sign-in link/);
    expect(link.text).toMatch(/\/api\/auth\/callback\/nodemailer\?/);
  });

  it("limits sign-ups per address", async () => {
    const email = uniqueEmail("enum-limit");
    for (let i = 0; i < BUDGETS.signUpEmail.points; i++) await signUpAs(email);
    const limited = await signUpAs(email);
    expect(limited.state).toMatchObject({
      status: "error",
      code: 429,
      message: expect.stringMatching(/^Too many sign-ups\. Try again in \d+ minutes\.$/),
    });
  });
});
