/**
 * Zod schemas shared by the auth forms (client), the server actions and the
 * Credentials provider. Safe to import in client components (no server code).
 *
 * Password policy (common practice, after NIST SP 800-63B §5.1.1.2): at least
 * 10 characters, at most 72 bytes (bcrypt's input limit), not one repeated
 * character, and not on a short list of the most common passwords.
 */
import { z } from "zod";
import { nameSchema } from "@/lib/validation/names";

const COMMON_PASSWORDS = new Set([
  "password",
  "password1",
  "password12",
  "password123",
  "1234567890",
  "0123456789",
  "qwertyuiop",
  "qwerty1234",
  "iloveyou12",
  "letmein123",
  "welcome123",
  "abc1234567",
  "changeme12",
  "passw0rd12",
  "admin12345",
  "ketwise123",
]);

export const emailSchema = z
  .string({ error: "Enter your e-mail address." })
  .trim()
  .min(1, "Enter your e-mail address.")
  .max(254, "That e-mail address is too long.")
  .pipe(z.email("Enter a valid e-mail address, like ada@example.org."))
  .transform((v) => v.toLowerCase());

export const passwordSchema = z
  .string({ error: "Choose a password." })
  .min(10, "Use at least 10 characters.")
  .refine(
    (v) => new TextEncoder().encode(v).length <= 72,
    "Use at most 72 bytes (about 72 characters).",
  )
  .refine((v) => new Set(v).size > 1, "Don't use one character repeated.")
  .refine(
    (v) => !COMMON_PASSWORDS.has(v.toLowerCase()),
    "That password is too common; choose another.",
  );

/** A person's display name (sign-up, joining by invitation). */
export const personNameSchema = nameSchema({ max: 80, empty: "Enter your name." });

export const signUpSchema = z.object({
  name: personNameSchema,
  email: emailSchema,
  password: passwordSchema,
});

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string().min(1, "Enter your password.").max(200),
});

export const magicLinkSchema = z.object({ email: emailSchema });

export type SignUpInput = z.infer<typeof signUpSchema>;
export type SignInInput = z.infer<typeof signInSchema>;
