/**
 * Writes for organisations, memberships and the audit trail (API keys: lib/api-keys).
 * Callers check the actor's role first (lib/auth/guards.ts); these functions
 * only keep the data consistent and scoped by organisation id.
 */
import "server-only";
import { eq } from "drizzle-orm";
import { db, type Executor } from "@/db";
import { auditEvents, memberships, organizations } from "@/db/schema";
import { orgNameSchema } from "@/lib/validation/names";
import type { Role } from "./roles";

export type AuditInput = {
  action: string;
  actorUserId?: string | null;
  actorApiKeyId?: string | null;
  targetType?: string;
  targetId?: string;
  metadata?: Record<string, unknown>;
  ip?: string | null;
};

export async function recordAuditEvent(
  orgId: string,
  event: AuditInput,
  executor: Executor = db,
): Promise<void> {
  await executor.insert(auditEvents).values({ orgId, ...event });
}

/** URL-safe slug from a name: lowercase ASCII words joined by "-", at most 60 chars. */
export function slugify(name: string): string {
  const base = name
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 60)
    .replace(/-+$/g, "");
  return base || "org";
}

async function uniqueSlug(name: string, executor: Executor): Promise<string> {
  const base = slugify(name);
  for (let attempt = 0; attempt < 8; attempt++) {
    const candidate = attempt === 0 ? base : `${base}-${crypto.randomUUID().slice(0, 6)}`;
    const taken = await executor
      .select({ id: organizations.id })
      .from(organizations)
      .where(eq(organizations.slug, candidate))
      .limit(1);
    if (taken.length === 0) return candidate;
  }
  throw new Error(`could not find a free slug for ${base}`);
}

/** Creates an organisation with `ownerUserId` as its owner, in one transaction. */
export async function createOrganization(
  input: { name: string; ownerUserId: string; slug?: string },
  executor: Executor = db,
): Promise<{ id: string; slug: string }> {
  const name = orgNameSchema.parse(input.name);
  const run = async (tx: Executor) => {
    const slug = input.slug ?? (await uniqueSlug(name, tx));
    const id = crypto.randomUUID();
    await tx.insert(organizations).values({ id, name, slug });
    await tx.insert(memberships).values({ orgId: id, userId: input.ownerUserId, role: "owner" });
    await recordAuditEvent(id, { action: "org.created", actorUserId: input.ownerUserId }, tx);
    return { id, slug };
  };
  return executor === db ? db.transaction((tx) => run(tx)) : run(executor);
}

/** Adds a user to an organisation, or changes their role if already a member. */
export async function upsertMembership(
  orgId: string,
  userId: string,
  role: Role,
  executor: Executor = db,
) {
  await executor
    .insert(memberships)
    .values({ orgId, userId, role })
    .onDuplicateKeyUpdate({ set: { role } });
}
