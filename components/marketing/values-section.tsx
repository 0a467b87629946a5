import { Section } from "./section";

const columns = [
  {
    key: "exact",
    swatch: <span className="h-4 w-0.5 rounded bg-exact" />,
    title: "The exact value",
    body: "⟨ψ|A|ψ⟩ from the full state — statevector for pure states, density matrix when noise is on. It is the reference every other number is judged against.",
    points: [
      "Pauli sums handled term by term, never expanded into 2ⁿ×2ⁿ matrices",
      "Hermitian matrices checked entry by entry, with the offending entry named",
      "Exact lowest and highest eigenvalues for small systems: the gap to the ground state",
    ],
  },
  {
    key: "sampled",
    swatch: <span className="size-2.5 rounded-full bg-sampled" />,
    title: "What N shots would report",
    body: "Terms that commute qubit by qubit share one measurement setting. Each setting is sampled, each term gets a mean and a standard error, and the total comes with its 95 % interval.",
    points: [
      "Per-setting histograms, bitstrings read qubit 0 first",
      "z-score of the deviation from exact and a plain verdict",
      "Every sample reproducible from the request and its seed",
    ],
  },
  {
    key: "noisy",
    swatch: <span className="size-2.5 rotate-45 bg-noisy" />,
    title: "What a noisy device would report",
    body: "Depolarizing, amplitude and phase damping after every gate, readout error on the samples. See the bias a noise model introduces, and what readout mitigation takes back.",
    points: [
      "Noise profiles saved per organisation, with plain help for each probability",
      "Readout-mitigated value printed beside the raw one",
      "Exact-under-noise Tr(ρA) to separate bias from shot noise",
    ],
  },
];

/** The three numbers Ketwise puts side by side. */
export function ValuesSection() {
  return (
    <Section
      id="values"
      eyebrow="One run, three numbers"
      title="The truth, the estimate, and the bias — on one screen"
      lead="Submit an OpenQASM circuit and a Hamiltonian written as a weighted Pauli sum. Ketwise answers with three numbers, and shows how far apart they are in units you can act on."
    >
      <div className="grid gap-px overflow-hidden rounded-xl border border-line bg-line md:grid-cols-3">
        {columns.map((c) => (
          <div key={c.key} className="grid content-start gap-4 bg-surface p-6">
            <div className="flex items-center gap-2.5">
              <span aria-hidden className="flex w-4 justify-center">
                {c.swatch}
              </span>
              <h3 className="text-base font-semibold text-ink">{c.title}</h3>
            </div>
            <p className="text-sm leading-6 text-ink-2">{c.body}</p>
            <ul className="grid gap-2 border-t border-line pt-4">
              {c.points.map((p) => (
                <li
                  key={p}
                  className="grid grid-cols-[auto_1fr] gap-2.5 text-[13px] leading-5 text-ink-2"
                >
                  <span aria-hidden className="mt-2 h-px w-2.5 bg-ink-3" />
                  {p}
                </li>
              ))}
            </ul>
          </div>
        ))}
      </div>
    </Section>
  );
}
