/**
 * The one server-action wrapper (lib/api/action.ts) as the new-run page uses it: JSON
 * actions answer the same ActionState as form actions — success with a message or
 * data, 422 with field errors for a refused input, the problem's code and detail for a
 * refused call — and a plain <form action> whose session is gone lands on sign-in.
 */
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { closeDb } from "@/db";
import { closeRedis } from "@/lib/rate-limit/redis";
import {
  deleteNoiseProfileAction,
  listNoiseProfilesAction,
  saveNoiseProfileAction,
} from "@/app/(app)/app/runs/new/noise-actions";
import { switchOrgAction } from "@/app/(app)/actions";
import { addMember, createUserWithOrg, sessionCookie } from "../../support/factories";
import { asBrowser } from "../security/support/next-context";

vi.mock(
  "next/headers",
  async () => (await import("../security/support/next-context")).nextHeadersModule,
);
vi.mock("next/cache", () => ({ revalidatePath: () => undefined, revalidateTag: () => undefined }));

let owner: Awaited<ReturnType<typeof createUserWithOrg>>;
let viewerCookie: string;

beforeAll(async () => {
  owner = await createUserWithOrg("actions");
  const viewer = await createUserWithOrg("actions-viewer");
  await addMember(owner.orgId, viewer.user.id, "viewer");
  viewerCookie = await sessionCookie(viewer.user.id);
});

afterAll(async () => {
  await closeRedis();
  await closeDb();
});

describe("JSON server actions", () => {
  it("save, list and delete answer ActionState with a message or data", async () => {
    asBrowser({ cookie: await sessionCookie(owner.user.id) });
    const saved = await saveNoiseProfileAction({
      orgId: owner.orgId,
      name: "Gentle",
      noise: { depolarizing1q: 0.001 },
    });
    expect(saved).toEqual({ status: "success", message: "Saved “Gentle”." });
    const listed = await listNoiseProfilesAction({ orgId: owner.orgId });
    expect(listed.status).toBe("success");
    const profiles = listed.status === "success" ? (listed.data ?? []) : [];
    expect(profiles.map((p) => p.name)).toEqual(["Gentle"]);
    expect(await deleteNoiseProfileAction({ orgId: owner.orgId, id: profiles[0].id })).toEqual({
      status: "success",
      message: "Deleted.",
    });
    expect(await deleteNoiseProfileAction({ orgId: owner.orgId, id: profiles[0].id })).toEqual({
      status: "error",
      message: "No such profile in this organisation.",
      code: 404,
    });
  });

  it("a refused input answers 422 with the schema's field errors", async () => {
    asBrowser({ cookie: await sessionCookie(owner.user.id) });
    const answer = await saveNoiseProfileAction({
      name: "",
      noise: { depolarizing1q: 2 },
    });
    expect(answer).toMatchObject({ status: "error", code: 422 });
    const fields = answer.status === "error" ? Object.keys(answer.fieldErrors ?? {}) : [];
    expect(fields.sort()).toEqual(["name", "noise.depolarizing1q"]);
    const bad = await deleteNoiseProfileAction({ id: "not-an-id" });
    expect(bad).toMatchObject({
      status: "error",
      code: 422,
      fieldErrors: { id: ["not a profile id"] },
    });
  });

  it("a weaker role answers 403 before the input is read; no session answers 401", async () => {
    asBrowser({ cookie: viewerCookie });
    const weak = await saveNoiseProfileAction({ orgId: owner.orgId, name: "x", noise: {} });
    expect(weak).toMatchObject({ status: "error", code: 403 });
    asBrowser({});
    expect(await listNoiseProfilesAction({})).toMatchObject({ status: "error", code: 401 });
  });
});

describe("plain <form action>s", () => {
  it("send a signed-out caller to the sign-in page", async () => {
    asBrowser({});
    const form = new FormData();
    form.set("orgId", owner.orgId);
    const thrown = await switchOrgAction(form).catch((e: unknown) => e);
    expect((thrown as { digest?: string }).digest).toMatch(/;\/sign-in\?error=SessionExpired;/);
  });
});
