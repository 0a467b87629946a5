/**
 * The one plan table. Quotas, the pricing section, the billing page and the
 * payment-provider catalogue all read it; nothing else hard-codes a limit or
 * a price.
 *
 * Conventions:
 * - Money is in integer minor units (US cents) with `currency: "usd"`, except
 *   overage unit prices, which may be fractions of a cent and are therefore
 *   given as decimal strings the provider accepts as `unit_amount_decimal`.
 * - Every quota is per organisation per calendar billing period (one month).
 * - `seatPriceCents` is charged per seat per month; seats are the quantity of
 *   the licensed subscription item.
 * - Overage exists only on paid plans. Sandbox quotas are hard caps (`overage`
 *   is `null`): a run that would exceed them is refused, never billed.
 * - Overage charge for a period = max(0, used − included) × unit price, where
 *   shots are billed per block of 1,000 (rounded up) and simulation time per
 *   whole second (rounded up).
 */

export const planIds = ["sandbox", "lab", "institute"] as const;

export type PlanId = (typeof planIds)[number];

export interface PlanLimits {
  /** Members plus pending invitations the organisation may hold. */
  readonly seats: number;
  /** Largest circuit the pure-state (statevector) engine will accept. */
  readonly maxStatevectorQubits: number;
  /** Largest circuit the mixed-state (density-matrix) engine will accept; 4ⁿ memory. */
  readonly maxDensityMatrixQubits: number;
  /** Shots included each month (sampled runs). */
  readonly monthlyShots: number;
  /** Engine wall-clock seconds included each month, summed over runs. */
  readonly monthlySimulationSeconds: number;
  /** Runs executing at the same time for one organisation. */
  readonly concurrentRuns: number;
  /** A single run is stopped after this many seconds. */
  readonly maxRunSeconds: number;
}

export interface PlanOverage {
  /** Price of each started block of 1,000 shots above the included quota, in cents. */
  readonly shotsPer1000Cents: number;
  /** Price of each simulation-second above the included quota, in cents (decimal string). */
  readonly simulationSecondCentsDecimal: string;
}

export interface Plan {
  readonly id: PlanId;
  readonly name: string;
  readonly currency: "usd";
  /** Monthly price per seat in cents; 0 for the free plan. */
  readonly seatPriceCents: number;
  readonly limits: PlanLimits;
  readonly overage: PlanOverage | null;
  readonly description: string;
  readonly features: readonly string[];
}

const table = {
  sandbox: {
    id: "sandbox",
    name: "Sandbox",
    currency: "usd",
    seatPriceCents: 0,
    limits: {
      seats: 3,
      maxStatevectorQubits: 20,
      maxDensityMatrixQubits: 8,
      monthlyShots: 1_000_000,
      monthlySimulationSeconds: 600,
      concurrentRuns: 1,
      maxRunSeconds: 60,
    },
    overage: null,
    description: "For trying ideas out: small circuits, a few colleagues, no card needed.",
    features: [
      "Up to 3 people in the workspace",
      "Exact expectation values up to 20 qubits",
      "Noisy simulation up to 8 qubits",
      "1 million shots and 10 simulation-minutes a month",
      "One run at a time",
    ],
  },
  lab: {
    id: "lab",
    name: "Lab",
    currency: "usd",
    seatPriceCents: 2_900,
    limits: {
      seats: 25,
      maxStatevectorQubits: 24,
      maxDensityMatrixQubits: 10,
      monthlyShots: 50_000_000,
      monthlySimulationSeconds: 36_000,
      concurrentRuns: 4,
      maxRunSeconds: 900,
    },
    overage: { shotsPer1000Cents: 5, simulationSecondCentsDecimal: "0.2" },
    description: "For a research group that runs studies every week and shares a library.",
    features: [
      "Up to 25 seats, billed monthly per seat",
      "Exact expectation values up to 24 qubits",
      "Noisy simulation up to 10 qubits",
      "50 million shots and 10 simulation-hours a month, then pay as you go",
      "Four runs in parallel, each up to 15 minutes",
    ],
  },
  institute: {
    id: "institute",
    name: "Institute",
    currency: "usd",
    seatPriceCents: 7_900,
    limits: {
      seats: 250,
      maxStatevectorQubits: 26,
      maxDensityMatrixQubits: 12,
      monthlyShots: 500_000_000,
      monthlySimulationSeconds: 360_000,
      concurrentRuns: 16,
      maxRunSeconds: 3_600,
    },
    overage: { shotsPer1000Cents: 3, simulationSecondCentsDecimal: "0.15" },
    description: "For departments and shared facilities with many groups and long studies.",
    features: [
      "Up to 250 seats, billed monthly per seat",
      "Exact expectation values up to 26 qubits",
      "Noisy simulation up to 12 qubits",
      "500 million shots and 100 simulation-hours a month, lower overage rates",
      "Sixteen runs in parallel, each up to an hour",
    ],
  },
} as const satisfies Record<PlanId, Plan>;

/** All plans, cheapest first. */
export const plans: readonly Plan[] = planIds.map((id) => table[id]);

/** Thrown by `getPlan` for an id that is not in the table. */
export class UnknownPlanError extends Error {
  constructor(readonly planId: string) {
    super(`Unknown plan "${planId}". Known plans: ${planIds.join(", ")}.`);
    this.name = "UnknownPlanError";
  }
}

export function isPlanId(value: unknown): value is PlanId {
  return typeof value === "string" && (planIds as readonly string[]).includes(value);
}

/** The plan with this id; throws `UnknownPlanError` for anything else. */
export function getPlan(id: string): Plan {
  if (!isPlanId(id)) throw new UnknownPlanError(id);
  return table[id];
}

/** True for plans charged through the payment provider (everything but Sandbox). */
export function isPaidPlan(plan: Plan): plan is Plan & { overage: PlanOverage } {
  return plan.seatPriceCents > 0 && plan.overage !== null;
}

/**
 * Overage charge in cents for one period, before the provider rounds the line:
 * shots in started blocks of 1,000 and seconds rounded up, both above quota.
 * Returns 0 on the free plan (its quotas are hard caps).
 */
export function overageCents(
  plan: Plan,
  used: { shots: number; simulationSeconds: number },
): number {
  if (!isPaidPlan(plan)) return 0;
  const extraShots = Math.max(0, used.shots - plan.limits.monthlyShots);
  const extraSeconds = Math.max(
    0,
    Math.ceil(used.simulationSeconds - plan.limits.monthlySimulationSeconds),
  );
  const shotBlocks = Math.ceil(extraShots / 1000);
  return (
    shotBlocks * plan.overage.shotsPer1000Cents +
    extraSeconds * Number(plan.overage.simulationSecondCentsDecimal)
  );
}
