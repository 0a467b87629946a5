/** Response schema of `GET /api/v1/usage`: this period's meters against the plan's quotas. */
import { z } from "zod";

const meter = (unit: string) =>
  z.object({
    used: z.number().describe(`Used this period (${unit})`),
    pending: z.number().describe("Reserved by queued and running runs"),
    included: z
      .number()
      .nullable()
      .describe("Included in the plan each month (null = not limited)"),
    remaining: z
      .number()
      .nullable()
      .describe("included − used − pending, never below 0 (null = not limited)"),
    overage: z.boolean().describe("True when use above `included` is billed instead of refused"),
  });

export const usageReportSchema = z
  .object({
    period: z.string().describe("Billing period, YYYY-MM (UTC)"),
    plan: z.object({ id: z.string(), name: z.string() }),
    meters: z.object({
      runs: z.object({ used: z.int() }),
      shots: meter("shots"),
      simulationSeconds: meter("seconds"),
    }),
    runs: z.object({
      queued: z.int(),
      running: z.int(),
      concurrentLimit: z.int().describe("Runs the plan executes at once; more wait queued"),
      unfinishedLimit: z
        .int()
        .describe("Queued + running runs accepted before submissions answer 429"),
    }),
    limits: z.object({
      maxStatevectorQubits: z.int(),
      maxDensityMatrixQubits: z.int(),
      maxRunSeconds: z.int(),
    }),
  })
  .meta({ id: "UsageReport", description: "This period's usage against the plan's quotas" });

export type UsageReport = z.infer<typeof usageReportSchema>;
