/**
 * The engine's request and result shapes as zod 4 schemas — the one
 * definition shared by forms, route handlers, the worker and the OpenAPI document
 * (the `.describe()` texts become its descriptions). Plain zod: the API layer registers
 * them with @asteasolutions/zod-to-openapi.
 *
 * Request objects are strict: an unknown field is an error, not silently dropped.
 */
import { INTERVAL_METHOD_SENTENCE } from "./sampling/interval";
import { z } from "zod";
import {
  MAX_MATRIX_QUBITS,
  MAX_OBSERVABLE_TERMS,
  MAX_POINTS,
  MAX_SEED,
  MAX_SHOTS,
  MAX_SOURCE_CHARS,
  MAX_SWEEP_POINTS,
} from "./estimate/limits";

/** Rows and columns of a matrix observable (its eigendecomposition stays within seconds). */
const MAX_MATRIX_DIM = 2 ** MAX_MATRIX_QUBITS;

const probability = z.number().min(0).max(1);

const matrixPart = (name: string) =>
  z
    .array(
      z
        .array(z.number())
        .max(
          MAX_MATRIX_DIM,
          `matrix observables are limited to ${MAX_MATRIX_QUBITS} qubits (${MAX_MATRIX_DIM}×${MAX_MATRIX_DIM})`,
        ),
    )
    .min(1)
    .max(
      MAX_MATRIX_DIM,
      `matrix observables are limited to ${MAX_MATRIX_QUBITS} qubits (${MAX_MATRIX_DIM}×${MAX_MATRIX_DIM})`,
    )
    .describe(
      `${name} part of the matrix, row-major, of A0 ⊗ A1 ⊗ … with qubit 0 the leftmost Kronecker factor: row/column index i = Σ_k b_k·2^(n−1−k) (qubit 0 is the most significant bit; kron(Z, I) is Z on qubit 0, like the dense word "ZI")`,
    );

export const circuitInputSchema = z
  .strictObject({
    format: z
      .enum(["qasm2", "qasm3"])
      .describe('"qasm2" (OpenQASM 2.0) or "qasm3" (the OpenQASM 3 subset with inputs)'),
    source: z
      .string()
      .min(1, "the circuit source is empty")
      .max(MAX_SOURCE_CHARS)
      .describe("Program text"),
  })
  .describe("The circuit that prepares the state");

export const pauliObservableSchema = z
  .strictObject({
    format: z.literal("pauli"),
    terms: z
      .string()
      .min(1, "the observable is empty")
      .max(MAX_SOURCE_CHARS)
      .describe('Weighted Pauli sum, e.g. "0.5 Z0 Z1 - 0.2 X0" or dense "XIZY"; qubit 0 first'),
  })
  .describe("Observable as a real-weighted sum of Pauli words");

export const matrixObservableSchema = z
  .strictObject({
    format: z.literal("matrix"),
    real: matrixPart("Real"),
    imag: matrixPart("Imaginary").optional(),
  })
  .describe(
    "Observable as a Hermitian 2^n × 2^n matrix (checked to a relative tolerance of 1e-10)",
  );

export const termsObservableSchema = z
  .strictObject({
    format: z.literal("terms"),
    terms: z
      .array(
        z.strictObject({
          coefficient: z.number().describe("Real coefficient of the word"),
          pauli: z
            .string()
            .min(1, "the Pauli word is empty")
            .max(MAX_SOURCE_CHARS)
            .describe(
              'One Pauli word, sparse ("X0 Z3") or dense ("XIZY", one letter per qubit); qubit 0 first',
            ),
        }),
      )
      .min(1, "the observable has no terms")
      .max(MAX_OBSERVABLE_TERMS, `at most ${MAX_OBSERVABLE_TERMS} terms`)
      .describe(
        "Σ coefficient·word; equal words are summed. Words follow the rules of Pauli-sum text, and errors point at terms[i].pauli",
      ),
  })
  .describe("Observable as a JSON list of weighted Pauli words (for generated Hamiltonians)");

export const observableInputSchema = z.discriminatedUnion("format", [
  pauliObservableSchema,
  matrixObservableSchema,
  termsObservableSchema,
]);

const readoutRates = {
  p1Given0: probability.optional().describe("Probability of reading 1 when the qubit is 0"),
  p0Given1: probability.optional().describe("Probability of reading 0 when the qubit is 1"),
};

const gateChannels = z.strictObject({
  depolarizing: probability
    .optional()
    .describe(
      "Depolarizing probability of the whole gate's 2^k-dimensional space (replaces depolarizing1q / depolarizing2q)",
    ),
  amplitudeDamping: probability
    .optional()
    .describe("Amplitude damping γ on each qubit (replaces amplitudeDamping)"),
  phaseDamping: probability
    .optional()
    .describe("Phase damping λ on each qubit (replaces phaseDamping)"),
});

/** Qubit index as a record key: "0", "1", … (at most 6 digits; checked against the circuit). */
const qubitKey = z.string().regex(/^(0|[1-9][0-9]{0,5})$/, 'a qubit index such as "0" or "3"');
/** Gate name as written in the circuit, e.g. "cx", "mygate", "ctrl @ x". */
const gateKey = z.string().min(1).max(120);

export const noiseModelSchema = z
  .strictObject({
    depolarizing1q: probability
      .optional()
      .describe(
        "Depolarizing probability p after each 1-qubit gate: ρ → (1−p)ρ + p·I/2 on its qubit (Nielsen & Chuang form), applied first",
      ),
    depolarizing2q: probability
      .optional()
      .describe(
        "Depolarizing probability p after each gate on k ≥ 2 qubits, acting JOINTLY on their 2^k-dimensional space: ρ → (1−p)ρ + p·(I/2^k ⊗ Tr_those ρ), applied first",
      ),
    amplitudeDamping: probability
      .optional()
      .describe("Amplitude damping γ on each qubit a gate touches"),
    phaseDamping: probability.optional().describe("Phase damping λ on each qubit a gate touches"),
    readout: z
      .strictObject({
        ...readoutRates,
        qubits: z
          .record(qubitKey, z.strictObject(readoutRates))
          .optional()
          .describe(
            'Per-qubit readout rates keyed by qubit index ("0" = qubit 0); unset fields use the two rates above',
          ),
      })
      .optional()
      .describe(
        "Readout error on sampled outcomes (never in `exact`); the same for every qubit unless `qubits` says otherwise",
      ),
    gates: z
      .record(gateKey, gateChannels)
      .optional()
      .describe(
        'Overrides by gate name as written in the circuit ("cx", "h", a user gate, "ctrl @ x"): after a call of that gate, the given fields replace the model\'s rates; unset fields keep them',
      ),
    idle: gateChannels
      .optional()
      .describe(
        "Idle noise (off unless given): after every gate, each qubit the gate does not touch gets the 1-qubit depolarizing channel, then amplitude and phase damping, with these rates",
      ),
  })
  .describe(
    "Noise model (probabilities). Once after every gate as written at the top level (a user gate or ccx counts once; id is a gate; barrier, measure and reset are not): (1) depolarizing of its qubits' joint space, then (2) amplitude damping and (3) phase damping on each of them; untouched qubits get nothing unless `idle` is given; per-gate overrides as described. Readout error acts on sampled outcomes only (never `exact`), the same on every qubit unless `readout.qubits` says otherwise. Gate and idle noise need the density-matrix method; readout error works with both",
  );

export const estimateRequestSchema = z
  .strictObject({
    circuit: circuitInputSchema,
    observable: observableInputSchema,
    method: z
      .enum(["statevector", "density_matrix"])
      .optional()
      .describe('Simulation method (default "statevector")'),
    shots: z
      .int()
      .min(0)
      .max(MAX_SHOTS)
      .optional()
      .describe("Total shots over all measurement settings; 0 = exact only (default 0)"),
    seed: z
      .int()
      .min(0)
      .max(MAX_SEED)
      .optional()
      .describe("PRNG seed; chosen and returned when absent"),
    parameters: z
      .record(z.string(), z.number())
      .optional()
      .describe("Values of the circuit's OpenQASM 3 inputs"),
    noise: noiseModelSchema.optional(),
    mitigateReadout: z
      .boolean()
      .optional()
      .describe("Also report the readout-mitigated sampled value"),
    targetPrecision: z
      .number()
      .positive()
      .optional()
      .describe("Target standard error; chooses the number of shots"),
    shotSplit: z
      .enum(["optimal", "even"])
      .optional()
      .describe('Shot split over settings: ∝ √Var (default "optimal") or even'),
    sweep: z
      .record(z.string(), z.array(z.number()).min(1).max(MAX_SWEEP_POINTS))
      .optional()
      .describe("Parameter grid: each named input takes every listed value (Cartesian product)"),
    points: z
      .array(z.record(z.string(), z.number()))
      .min(1, "points is empty: give at least one binding")
      .max(MAX_POINTS, `at most ${MAX_POINTS} points per run`)
      .optional()
      .describe(
        "Explicit list of input bindings, evaluated in order (exclusive with sweep). Each point overrides `parameters`; together they must give every declared input.",
      ),
    gradient: z
      .boolean()
      .optional()
      .describe(
        "Also compute d⟨A⟩/d(input) for every declared input: exact by adjoint differentiation, sampled by parameter-shift rules when shots are drawn (the shifted circuits' shots are counted and billed)",
      ),
  })
  .superRefine((req, ctx) => {
    if (req.targetPrecision !== undefined && (req.shots ?? 0) > 0) {
      ctx.addIssue({
        code: "custom",
        path: ["targetPrecision"],
        message: "give either shots or targetPrecision, not both",
      });
    }
    if (req.sweep && req.points) {
      ctx.addIssue({
        code: "custom",
        path: ["points"],
        message: "give either sweep (a grid) or points (a list), not both",
      });
    }
    if (req.sweep) {
      const points = Object.values(req.sweep).reduce((a, v) => a * v.length, 1);
      if (points > MAX_SWEEP_POINTS) {
        ctx.addIssue({
          code: "custom",
          path: ["sweep"],
          message: `the sweep grid has ${points} points; at most ${MAX_SWEEP_POINTS}`,
        });
      }
    }
  })
  .describe("An expectation-value run: circuit, observable and how to estimate");

export type EstimateRequest = z.infer<typeof estimateRequestSchema>;

const gradientSchema = z
  .record(
    z.string(),
    z.object({
      exact: z.number().describe("d/d(input) of the exact value (of the noisy Tr(ρA) under noise)"),
      sampled: z
        .object({
          mean: z.number(),
          stdErr: z.number().describe("Standard error of the shift-rule estimate"),
        })
        .optional()
        .describe("Parameter-shift estimate from the shifted circuits' shots"),
    }),
  )
  .describe("Derivative of the expectation value with respect to every declared input");
const interval = z.tuple([z.number(), z.number()]);

const estimateSchema = z.object({
  mean: z
    .number()
    .describe("Sample mean: constant part plus the average of each setting's shot values"),
  stdErr: z
    .number()
    .describe(
      "Posterior standard deviation of the mean (Dirichlet posterior per setting with one pseudo-shot at each end of its value range); never 0 from finitely many shots",
    ),
  ci95: interval.describe(
    "95 % interval: per setting posterior mean ± Student t quantile × posterior sd, settings combined by square-and-add (MOVER) around the mean, clipped to the possible values",
  ),
});

export const convergencePointSchema = z.object({
  shots: z.int().describe("Shots used so far (a prefix of every setting)"),
  mean: z.number(),
  stdErr: z.number(),
  ci95: interval
    .optional()
    .describe("95 % interval at this prefix (same method as `sampled.ci95`)"),
});

export const shotPlanSchema = z
  .object({
    targetPrecision: z.number(),
    settings: z.int(),
    worstCase: z
      .object({ totalShots: z.number(), perSetting: z.array(z.number()) })
      .describe("(Σ|c_i|)²/ε², valid for any state"),
    stateAware: z
      .object({ totalShots: z.number(), perSetting: z.array(z.number()) })
      .nullable()
      .describe(
        "Fewest shots whose expected posterior standard error (the reported stdErr) is at most ε, from the state's exact per-setting means and variances",
      ),
  })
  .describe("Shots needed for a target standard error (McClean et al. 2016)");

export const pauliDecompositionSchema = z
  .object({
    terms: z
      .array(
        z.object({
          pauli: z.string().describe("Dense Pauli word, qubit 0 first"),
          label: z.string().describe('Sparse label, e.g. "X0 Z3"'),
          coefficient: z.number().describe("Tr(P·A)/2^n"),
        }),
      )
      .describe("Non-zero components, largest |coefficient| first (at most 256)"),
    omitted: z.int().describe("Non-zero components beyond the 256 listed"),
  })
  .describe("How a matrix observable of ≤ 6 qubits was read: A = Σ_P c_P·P with c_P = Tr(P·A)/2^n");

export const estimateResultSchema = z
  .object({
    qubits: z.int(),
    method: z.enum(["statevector", "density_matrix"]),
    seed: z.int(),
    ideal: z.object({ value: z.number() }).describe("Noiseless exact ⟨ψ|A|ψ⟩"),
    exact: z
      .object({ value: z.number() })
      .describe("Exact value under the noise model, Tr(ρA) (no readout error)"),
    sampled: estimateSchema
      .extend({
        shots: z.int(),
        settings: z.int(),
        convergence: z
          .array(convergencePointSchema)
          .describe("Running estimate at log-spaced shot counts"),
      })
      .nullable()
      .describe(
        `Estimate from shots (readout error included), or null without shots. ${INTERVAL_METHOD_SENTENCE}`,
      ),
    mitigated: estimateSchema
      .optional()
      .describe("Readout-mitigated sampled value (tensored inverse)"),
    terms: z.array(
      z.object({
        pauli: z.string().describe("Dense Pauli word, qubit 0 first"),
        label: z.string().describe('Sparse label, e.g. "X0 Z3"'),
        coefficient: z.number(),
        exact: z.number().describe("Exact ⟨P⟩ under the noise model"),
        sampledMean: z.number().optional(),
        stdErr: z
          .number()
          .optional()
          .describe(
            "Posterior standard deviation of the term's ⟨P⟩ (same method as `sampled.stdErr`)",
          ),
        ci95: interval.optional().describe("95 % interval of ⟨P⟩"),
        mitigatedMean: z.number().optional(),
        mitigatedStdErr: z.number().optional(),
        mitigatedCi95: interval.optional(),
        group: z
          .int()
          .nullable()
          .describe("Index of the measurement setting (null for the identity)"),
      }),
    ),
    groups: z.array(
      z.object({
        bases: z
          .string()
          .describe('Basis per qubit, qubit 0 first (X, Y, Z, I = unmeasured), or "eigenbasis"'),
        terms: z.array(z.int()),
        shots: z.int(),
        counts: z
          .record(z.string(), z.int())
          .optional()
          .describe(
            'Histogram keyed by bitstring, qubit 0 first; for "eigenbasis" the key is the outcome index k (the k-th eigenvalue, ascending) in n binary digits, most significant first',
          ),
        distinctOutcomes: z.int().optional(),
        variance: z.number().optional().describe("Exact single-shot variance of the setting"),
        eigenvalues: z
          .array(z.number())
          .optional()
          .describe(
            "Matrix observables: eigenvalue of outcome index k (ascending; the count key of k is k in binary)",
          ),
      }),
    ),
    spectrum: z
      .object({
        min: z.number(),
        max: z.number(),
        lowest: z
          .array(z.number())
          .optional()
          .describe(
            "The 4 lowest eigenvalues with multiplicity, ascending (fewer when the dimension is smaller); absent on runs stored before this field",
          ),
        groundDegeneracy: z
          .int()
          .optional()
          .describe(
            "Dimension of the lowest eigenspace (eigenvalues within 1e-8·max(1, scale) of the lowest count as one level; scale = Σ|c| for Pauli sums, max |λ| for matrices); absent when it is 16 or more for a Pauli sum",
          ),
        groundWeight: z
          .number()
          .optional()
          .describe(
            "Weight of the top-level point's state in the whole lowest eigenspace: ⟨ψ|P₀|ψ⟩, or Tr(P₀ρ) for the density-matrix method (noise included); 1 means a ground state. Absent when groundDegeneracy is",
          ),
      })
      .optional()
      .describe(
        "Exact extreme eigenvalues of the observable (matrix observables; Pauli sums on ≤ 16 qubits with at most 2^22 / 2^n distinct X/Y patterns)",
      ),
    shotPlan: shotPlanSchema.optional(),
    gradient: gradientSchema.optional(),
    gradientShots: z
      .int()
      .optional()
      .describe("Shots of the parameter-shifted circuits (main point)"),
    pauliDecomposition: pauliDecompositionSchema.optional(),
    sweep: z
      .object({
        kind: z
          .enum(["grid", "points"])
          .optional()
          .describe('"grid" for a sweep, "points" for an explicit list (absent: grid)'),
        topLevel: z
          .object({
            index: z.int().describe("Index into `points` of the point the top level describes"),
            rule: z
              .literal("lowest_exact")
              .describe("The point with the lowest exact value (ties: the earliest)"),
          })
          .optional()
          .describe(
            "Which point the top-level ideal/exact/sampled/terms/groups/gradient describe: the point of lowest exact value, not silently point 0 (absent on runs stored before this field: there it was point 0)",
          ),
        parameters: z.array(z.string()),
        points: z.array(
          z.object({
            params: z.record(z.string(), z.number()),
            ideal: z.number(),
            exact: z.number(),
            sampled: estimateSchema.extend({ shots: z.int() }).nullable(),
            gradient: gradientSchema.optional(),
            gradientShots: z
              .int()
              .optional()
              .describe("Shots of this point's parameter-shifted circuits"),
          }),
        ),
      })
      .optional(),
    timings: z.object({
      parseMs: z.number(),
      simulateMs: z.number(),
      sampleMs: z.number(),
      spectrumMs: z.number(),
    }),
  })
  .describe("Result of an expectation-value run");

export type EstimateResult = z.infer<typeof estimateResultSchema>;

export const previewResultSchema = z
  .object({
    qubits: z.int(),
    method: z.enum(["statevector", "density_matrix"]),
    gateCounts: z.record(z.string(), z.int()),
    totalGates: z.int(),
    twoQubitGates: z.int(),
    depth: z.int(),
    observable: z.object({
      format: z.enum(["pauli", "matrix"]),
      terms: z.int(),
      settings: z.int(),
    }),
    groups: z.array(z.object({ bases: z.string(), terms: z.array(z.int()) })),
    stateBytes: z
      .number()
      .describe("Memory of one simulated state (16·2^n B statevector, 16·4^n B density matrix)"),
    sweepPoints: z.int().describe("Parameter points of the run (grid points or listed points)"),
    shots: z
      .int()
      .describe(
        "Shots per parameter point (planned from targetPrecision when given; the largest over the points when their plans differ)",
      ),
    gradient: z
      .object({
        inputs: z.array(z.string()),
        shiftedCircuits: z.int().describe("Parameter-shifted circuits per point (0 without shots)"),
        shotsPerPoint: z.int().describe("Extra shots per point for the sampled gradient"),
      })
      .nullable()
      .describe("Gradient plan when `gradient` is true"),
    totalShots: z
      .int()
      .describe(
        "Shots over all parameter points, the gradient's shifted circuits included: what the quota check reserves",
      ),
    shotPlan: shotPlanSchema.nullable(),
    shotsPerSetting: z.array(z.int()).nullable(),
    pauliDecomposition: pauliDecompositionSchema.optional(),
    varianceSource: z
      .enum(["state_aware", "worst_case"])
      .describe(
        'What the targetPrecision plan used: "state_aware" = the state\'s exact variances (the state was simulated within the preview\'s work budget; the run draws exactly these shots) or "worst_case" = variance bounds valid for any state (the run plans from the exact variances and usually draws fewer). Without targetPrecision: "worst_case" (only the per-setting split shown)',
      ),
    planWork: z
      .object({
        estimated: z
          .number()
          .describe("Amplitude updates a state-aware plan needs (simulating every point)"),
        budget: z.number().describe("The preview's budget for it"),
      })
      .nullable()
      .describe(
        "With targetPrecision: the work a state-aware plan costs against the budget (which decided varianceSource)",
      ),
    notes: z.array(z.string()),
  })
  .describe(
    "Preview of a run: parse, counts, settings and the shot plan (state-aware within a work budget)",
  );

export type PreviewResult = z.infer<typeof previewResultSchema>;

/** Operations an outline lists at most (the rest are counted in `omitted`). */
export const MAX_OUTLINE_OPS = 400;

const outlineOpSchema = z.discriminatedUnion("kind", [
  z.object({
    kind: z.literal("gate"),
    name: z.string().describe('Gate name as written, e.g. "cx", "rz", a user gate'),
    qubits: z.array(z.int()).describe("Operand qubits, in operand order"),
    params: z.array(z.number()).describe("Bound angle parameters (radians)"),
  }),
  z.object({ kind: z.literal("measure"), qubit: z.int(), clbit: z.int() }),
  z.object({ kind: z.literal("reset"), qubit: z.int() }),
  z.object({ kind: z.literal("barrier"), qubits: z.array(z.int()) }),
]);

export const circuitOutlineSchema = z
  .object({
    qubits: z.int().describe("Qubits of the circuit"),
    qubitLabels: z
      .array(z.string())
      .describe('Display label of each qubit, qubit 0 first (e.g. "q[0]", "anc[0]")'),
    inputs: z
      .array(z.object({ name: z.string(), type: z.enum(["float", "angle"]) }))
      .describe("The circuit's OpenQASM 3 inputs, in declaration order"),
    ops: z
      .array(outlineOpSchema)
      .max(MAX_OUTLINE_OPS)
      .describe(
        `The first top-level operations (at most ${MAX_OUTLINE_OPS}) with their parameters bound: a call of a user gate or ccx is one operation`,
      ),
    omitted: z.int().describe("Top-level operations beyond `ops`"),
    placeholders: z
      .array(z.string())
      .describe("Inputs without a value in `parameters` (or swept), drawn with 0"),
  })
  .meta({
    id: "CircuitOutline",
    description:
      "What a circuit diagram needs: qubits and their labels, the inputs, and the first operations with bound parameters",
  });

export type CircuitOutline = z.infer<typeof circuitOutlineSchema>;
