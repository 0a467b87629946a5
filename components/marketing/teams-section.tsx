import { Section } from "./section";

const roles = [
  [
    "Owner",
    "Everything an admin can do, plus transferring ownership and deleting the organisation.",
  ],
  ["Admin", "Members, invitations, organisation API keys, plan, seats and invoices."],
  ["Member", "Creates runs, library items and personal API keys."],
  ["Viewer", "Reads runs, results and the library; changes nothing."],
];

/** Organisations, roles, usage and the audit trail. */
export function TeamsSection() {
  return (
    <Section
      id="teams"
      eyebrow="Teams"
      title="Built for a group that shares a budget"
      lead="Each organisation has its own runs, library, noise profiles, keys and quota. People can belong to several organisations and switch between them."
    >
      <div className="grid gap-8 lg:grid-cols-[1.3fr_1fr]">
        <div className="overflow-hidden rounded-xl border border-line bg-surface">
          <table className="w-full text-left text-sm">
            <caption className="sr-only">Roles and what they may do</caption>
            <tbody className="divide-y divide-line">
              {roles.map(([role, text]) => (
                <tr key={role}>
                  <th scope="row" className="w-28 px-5 py-3.5 align-top font-semibold text-ink">
                    {role}
                  </th>
                  <td className="px-5 py-3.5 leading-6 text-ink-2">{text}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <dl className="grid content-start gap-5">
          {[
            [
              "Usage you can see",
              "Runs, shots and simulation time metered against the plan, with a meter on the dashboard.",
            ],
            [
              "An audit log",
              "Sign-ins, invitations, role changes, keys and plan changes — who, what, when.",
            ],
            [
              "A shared library",
              "Circuits, observables and noise profiles with names, descriptions and tags.",
            ],
          ].map(([t, d]) => (
            <div key={t} className="grid gap-1 border-l-2 border-line pl-4">
              <dt className="text-[15px] font-semibold text-ink">{t}</dt>
              <dd className="text-sm leading-6 text-ink-2">{d}</dd>
            </div>
          ))}
        </dl>
      </div>
    </Section>
  );
}
