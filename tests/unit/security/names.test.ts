/**
 * Names refuse control characters and Unicode bidirectional formatting
 * characters (Unicode Standard Annex #9 §2; the "Trojan Source" attack,
 * CVE-2021-42574), in every shared schema, so forms and the API agree.
 * E-mail subjects carry only a sanitised, length-capped name.
 */
import { describe, expect, it } from "vitest";
import { createApiKeySchema } from "@/lib/api-keys/schemas";
import { signUpSchema } from "@/lib/auth/schemas";
import { acceptWithSignUpSchema } from "@/lib/invitations/schemas";
import { circuitCreateSchema, observableCreateSchema } from "@/lib/library/schemas";
import { invitationMail, runFinishedMailFrom } from "@/lib/mail/templates";
import { noiseProfileInputSchema } from "@/lib/noise-profiles/schemas";
import { runCreateSchema } from "@/lib/runs/schemas";
import { createWebhookSchema } from "@/lib/webhooks/schemas";
import { NAME_CHARACTERS_MESSAGE, orgNameSchema, subjectSafeName } from "@/lib/validation/names";

const BELL = {
  format: "qasm2",
  source: 'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[1];\nh q[0];\n',
};

const nameFields: {
  label: string;
  parse: (name: string) => {
    success: boolean;
    error?: { issues: { message: string; path: PropertyKey[] }[] };
  };
}[] = [
  {
    label: "run",
    parse: (name) =>
      runCreateSchema.safeParse({
        circuit: BELL,
        observable: { format: "pauli", terms: "Z0" },
        name,
      }),
  },
  { label: "library circuit", parse: (name) => circuitCreateSchema.safeParse({ ...BELL, name }) },
  {
    label: "library observable",
    parse: (name) => observableCreateSchema.safeParse({ format: "pauli", terms: "Z0", name }),
  },
  {
    label: "noise profile",
    parse: (name) => noiseProfileInputSchema.safeParse({ name, noise: {} }),
  },
  { label: "API key", parse: (name) => createApiKeySchema.safeParse({ name, role: "viewer" }) },
  {
    label: "person (sign-up)",
    parse: (name) =>
      signUpSchema.safeParse({ name, email: "ada@example.org", password: "a sound password" }),
  },
  {
    label: "person (invitation)",
    parse: (name) =>
      acceptWithSignUpSchema.safeParse({
        name,
        token: "x".repeat(20),
        password: "a sound password",
      }),
  },
  { label: "organisation", parse: (name) => orgNameSchema.safeParse(name) },
  {
    label: "webhook description",
    parse: (name) =>
      createWebhookSchema.safeParse({ url: "https://example.com/hooks", description: name }),
  },
];

const bad = [
  ["NUL", "lab\u0000run"],
  ["right-to-left override", "invoice\u202Egpj.exe"],
  ["left-to-right embedding", "a\u202Ab"],
  ["pop directional formatting", "a\u202Cb"],
  ["right-to-left isolate", "a\u2067b"],
  ["pop directional isolate", "a\u2069b"],
  ["right-to-left mark", "a\u200Fb"],
  ["Arabic letter mark", "a\u061Cb"],
  ["line feed inside", "first\nsecond"],
  ["carriage return inside", "first\rsecond"],
  ["tab inside", "a\tb"],
  ["escape", "a\u001b[31mred"],
  ["DEL", "a\u007Fb"],
  ["C1 control", "a\u0085b"],
];

describe("names in every shared schema", () => {
  for (const field of nameFields) {
    it(`${field.label}: refuses control and bidi characters with one clear message`, () => {
      for (const [what, value] of bad) {
        const result = field.parse(value);
        expect(result.success, `${field.label} accepted ${what}`).toBe(false);
        const issue = result.error!.issues.find((i) => i.message === NAME_CHARACTERS_MESSAGE);
        expect(issue, `${field.label} / ${what}`).toBeDefined();
      }
    });

    it(`${field.label}: keeps ordinary names, accents, CJK and right-to-left scripts`, () => {
      for (const ok of [
        "Ground state of H₂",
        "Énergie — essai 3",
        "量子回路",
        "דוגמה",
        "مثال",
        "O'Brien's lab",
      ]) {
        expect(field.parse(ok).success, `${field.label}: ${ok}`).toBe(true);
      }
    });
  }
});

describe("e-mail subjects", () => {
  it("subjectSafeName flattens controls and bidi characters and caps the length", () => {
    expect(subjectSafeName("a\r\nBcc: x@evil.example")).toBe("a Bcc: x@evil.example");
    expect(subjectSafeName("x\u202Eyz")).toBe("x yz");
    const long = subjectSafeName("n".repeat(500));
    expect(Array.from(long)).toHaveLength(40);
    expect(long.endsWith("…")).toBe(true);
  });

  it("a run-finished subject carries only the capped run name", () => {
    const mail = runFinishedMailFrom({
      runName: `Urgent\r\nReply-To: x@evil.example ${"!".repeat(300)}`,
      verb: "finished",
      duration: "2 min 00 s",
      outcome: "ok",
      url: "http://localhost/app",
    });
    expect(mail.subject).not.toMatch(/[\r\n]/);
    expect(mail.subject.length).toBeLessThanOrEqual(60);
  });

  it("an invitation subject names the organisation only, never the inviter's chosen name", () => {
    const mail = invitationMail({
      orgName: "Quantum Lab",
      inviterName: "Your bank: verify at evil.example",
      roleLabel: "Viewer",
      url: "http://localhost/x",
      expires: "soon",
    });
    expect(mail.subject).toBe("You are invited to Quantum Lab on Ketwise");
  });
});
