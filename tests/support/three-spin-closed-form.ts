/**
 * E(θ) of Ketwise's invented three-spin cluster along its ansatz, by hand (independent of
 * the engine). The ansatz `ry(θ) q[0]; cx q[0], q[1]; cx q[1], q[2]` prepares, qubit 0
 * first, |ψ⟩ = α|000⟩ + β|111⟩ with α = cos θ/2, β = sin θ/2 (textbook: ry(θ)|0⟩ =
 * cos θ/2|0⟩ + sin θ/2|1⟩, each cx copies the control's bit). On it ⟨Zᵢ⟩ = α² − β² = cos θ,
 * ⟨ZᵢZⱼ⟩ = 1, ⟨Xᵢ⟩ = 0 (one flip leaves the span), ⟨X0X1X2⟩ = 2αβ = sin θ, and since
 * Y|0⟩ = i|1⟩, Y|1⟩ = −i|0⟩, Y0Y1X2 maps |000⟩ → −|111⟩ and |111⟩ → −|000⟩, so
 * ⟨Y0Y1X2⟩ = −sin θ (Pauli matrix algebra, common practice). For
 *   c0 + J(Z0Z1 + Z1Z2) + h(Z0 + Z1 + Z2) + g(X0 + X1 + X2) + k X0X1X2 + m Y0Y1X2:
 * E(θ) = c0 + 2J + 3h·cos θ + (k − m)·sin θ.
 */
import { CLUSTER } from "@/lib/examples/three-spin-cluster";

export function threeSpinEnergy(theta: number): number {
  const { c0, J, h, k, m } = CLUSTER;
  return c0 + 2 * J + 3 * h * Math.cos(theta) + (k - m) * Math.sin(theta);
}
