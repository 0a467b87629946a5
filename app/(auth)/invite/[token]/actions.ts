"use server";

import { redirect } from "next/navigation";
import { formAction, userAction } from "@/lib/api/action";
import { signIn } from "@/lib/auth";
import { setCurrentOrgCookie } from "@/lib/auth/org-cookie";
import { getUserById } from "@/lib/auth/queries";
import { signUp } from "@/lib/auth/sign-up";
import { acceptInvitation } from "@/lib/invitations/mutations";
import { invitationLinkProblem } from "@/lib/invitations/problems";
import { previewInvitation } from "@/lib/invitations/queries";
import { acceptInvitationSchema, acceptWithSignUpSchema } from "@/lib/invitations/schemas";

/** Signed-in invitee: joins with the invited role and opens the organisation. */
export const acceptInvitationAction = userAction(
  acceptInvitationSchema,
  async (input, { userId }) => {
    const user = await getUserById(userId);
    const { orgId } = await acceptInvitation(input.token, {
      id: userId,
      email: user?.email ?? null,
    });
    await setCurrentOrgCookie(orgId);
    redirect("/app?joined=1");
  },
);

/**
 * New person: creates the account with the invited e-mail (the link came to
 * that inbox, which proves it), joins, signs in and opens the organisation.
 */
export const joinWithNewAccountAction = formAction(acceptWithSignUpSchema, async (input) => {
  const preview = await previewInvitation(input.token);
  if (!preview.ok) throw invitationLinkProblem(preview.problem);
  const { userId } = await signUp(
    { name: input.name, email: preview.email, password: input.password },
    { verified: true },
  );
  const { orgId } = await acceptInvitation(input.token, { id: userId, email: preview.email });
  await signIn("credentials", { email: preview.email, password: input.password, redirect: false });
  await setCurrentOrgCookie(orgId);
  redirect("/app?joined=1");
});
