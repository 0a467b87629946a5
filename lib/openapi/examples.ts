/**
 * Example requests for the API documentation: a Bell pair (H then CX) and the
 * CHSH-type observable √2(Z⊗Z + X⊗X), whose exact value on the Bell state is
 * 2√2 ≈ 2.8284 (Tsirelson's bound; B. S. Cirel'son, Lett. Math. Phys. 4, 93 (1980)).
 */
export const bellRunExample = {
  name: "Bell pair, CHSH operator",
  circuit: {
    format: "qasm2",
    source: 'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[2];\nh q[0];\ncx q[0],q[1];\n',
  },
  observable: { format: "pauli", terms: "1.4142135623730951 Z0 Z1 + 1.4142135623730951 X0 X1" },
  shots: 1000,
  seed: 7,
} as const;
