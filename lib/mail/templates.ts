/**
 * Every Ketwise e-mail, rendered from Handlebars templates in ./templates/
 * (one file per message, a shared frame in ./templates/layout.ts). Each
 * function returns `{ subject, text, html }` for `sendMail`.
 */
export { magicLinkMail } from "./templates/magic-link";
export { accountExistsMail } from "./templates/account-exists";
export { invitationMail, type InvitationMailData } from "./templates/invitation";
export {
  invoiceAvailableMail,
  paymentFailedMail,
  type InvoiceMailData,
  type PaymentFailedMailData,
} from "./templates/billing";
export { runFinishedMailFrom, type RunFinishedMailData } from "./templates/run-finished";
export type { RenderedMail } from "./templates/layout";
