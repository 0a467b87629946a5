/** Typed failures of invitations: seats used up, and links that cannot be used (each with a plain reason). */
import { ProblemError } from "@/lib/api/problem";
import type { TokenProblem } from "./token";
import { plural } from "@/lib/format";

export type SeatFigures = { members: number; pending: number; used: number; limit: number };

/**
 * 402 when every seat is taken. The detail says how the seats are used and
 * offers the way out: add seats (paid plan below its maximum), or upgrade.
 */
export function seatsExhausted(
  plan: { id: string; name: string; limits: { seats: number } },
  seats: SeatFigures,
  paid: boolean,
): ProblemError {
  const usage = `${plural(seats.members, "member")} and ${plural(seats.pending, "pending invitation")}`;
  let detail: string;
  if (!paid) {
    detail = `The ${plan.name} plan allows ${plural(plan.limits.seats, "person", "people")} and all seats are in use (${usage}). Upgrade to a paid plan on the billing page to invite more people.`;
  } else if (seats.limit >= plan.limits.seats) {
    detail = `All ${plural(seats.limit, "seat")} of the ${plan.name} plan are in use (${usage}); that is the plan's maximum. Move to a larger plan on the billing page to invite more people.`;
  } else {
    detail = `All ${plural(seats.limit, "paid seat")} are in use (${usage}). Add seats on the billing page to invite more people.`;
  }
  return new ProblemError({
    type: "/problems/seats-exhausted",
    title: "No free seat",
    status: 402,
    detail,
  });
}

const LINK_PROBLEMS: Record<
  TokenProblem | "unknown" | "revoked" | "used",
  { status: number; detail: string }
> = {
  malformed: {
    status: 400,
    detail:
      "This invitation link is incomplete. Open it again from the e-mail, or ask for a new invitation.",
  },
  forged: {
    status: 400,
    detail:
      "This invitation link is not valid. Open it again from the e-mail, or ask for a new invitation.",
  },
  expired: {
    status: 410,
    detail: "This invitation has expired. Ask an admin of the organisation to send it again.",
  },
  unknown: {
    status: 410,
    detail:
      "This invitation link is no longer valid: a newer invitation e-mail replaced it, or it was withdrawn. Use the newest e-mail, or ask for a new invitation.",
  },
  revoked: {
    status: 410,
    detail: "This invitation was withdrawn by an admin of the organisation.",
  },
  used: {
    status: 409,
    detail: "This invitation has already been used. Sign in to open the organisation.",
  },
};

export type LinkProblem = keyof typeof LINK_PROBLEMS;

export function invitationLinkProblem(kind: LinkProblem): ProblemError {
  const { status, detail } = LINK_PROBLEMS[kind];
  return new ProblemError({
    type: `/problems/invitation-${kind}`,
    title: "Invitation link not usable",
    status,
    detail,
  });
}

export function wrongRecipient(invited: string, signedInAs: string | null): ProblemError {
  return new ProblemError({
    type: "/problems/invitation-wrong-recipient",
    title: "Invitation for someone else",
    status: 403,
    detail: `This invitation is for ${invited}${signedInAs ? `, but you are signed in as ${signedInAs}` : ""}. Sign out and open the link again as ${invited}.`,
  });
}
