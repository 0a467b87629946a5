/**
 * The demo scenario (invented): Halcyon Materials Lab, a small group that
 * screens battery-cathode materials with variational circuits. Three people
 * with three roles, one shared demo password.
 */
import type { Role } from "@/lib/orgs/roles";

export const DEMO_PASSWORD = "halcyon-demo-lab";

export const DEMO_ORG = { name: "Halcyon Materials Lab", slug: "halcyon-materials-lab" } as const;

export const DEMO_USERS: { name: string; email: string; role: Role }[] = [
  { name: "Mira Okafor", email: "mira@halcyon.example", role: "owner" },
  { name: "Tomás Lindqvist", email: "tomas@halcyon.example", role: "member" },
  { name: "Priya Raman", email: "priya@halcyon.example", role: "viewer" },
];
