// Every e-mail the product sends, in one place. Add a template here and a method to
// server/services/mail.ts.
export { emailChangedMail, passwordChangedMail } from './account-notices';
export { invitationMail, type InvitationMail } from './invitation';
export { compose, escapeHtml, PRODUCT_NAME, type MailBody, type MailContent } from './layout';
export { passwordResetMail, type PasswordResetMail } from './password-reset';
export { repairCompletedMail, requestConfirmedMail, troubleNoticedMail, visitScheduledMail } from './tenant-requests';
export {
  managerNoticeMail,
  workOrderCancelledMail,
  workOrderDispatchedMail,
  workOrderEscalatedToYouMail,
  workOrderReopenedMail,
  type JobBrief,
} from './work-orders';
