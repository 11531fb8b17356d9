import { compose, PRODUCT_NAME, type MailContent } from './layout';

interface TenantMail {
  displayName: string;
  applianceText: string;
  url: string;
}

const MUTE_NOTE = `You can mute messages that are not urgent on your profile page in ${PRODUCT_NAME}.`;

export function requestConfirmedMail(mail: TenantMail & { attached: boolean }): MailContent {
  return compose({
    subject: `We received your report about the ${mail.applianceText}`,
    greeting: `Hello ${mail.displayName},`,
    paragraphs: [
      mail.attached
        ? `Thank you. A repair request for the ${mail.applianceText} was already open; your report has been added to it, so the technician sees it.`
        : `Thank you. Your report about the ${mail.applianceText} has reached your property manager as a repair request.`,
      'You can follow its progress on your home page: when it is dispatched, when the visit is scheduled and when the repair is done.',
    ],
    action: { label: 'See the request', url: mail.url },
    notes: [MUTE_NOTE],
  });
}

export function troubleNoticedMail(mail: TenantMail & { guidance: string[] }): MailContent {
  return compose({
    subject: `Your ${mail.applianceText} is warming up: what to do with your food`,
    greeting: `Hello ${mail.displayName},`,
    paragraphs: [
      `${PRODUCT_NAME} noticed that the ${mail.applianceText} in your unit is not keeping its normal temperature. A repair request is open and your property manager has been told.`,
      ...mail.guidance,
    ],
    action: { label: 'See the current temperatures', url: mail.url },
  });
}

export function visitScheduledMail(mail: TenantMail & { window: string; contractorName: string }): MailContent {
  return compose({
    subject: `Repair visit scheduled: ${mail.window}`,
    greeting: `Hello ${mail.displayName},`,
    paragraphs: [`${mail.contractorName} will come to repair the ${mail.applianceText} ${mail.window}.`, 'If that time no longer suits you, tell your property manager.'],
    action: { label: 'See the request', url: mail.url },
    notes: [MUTE_NOTE],
  });
}

export function repairCompletedMail(mail: TenantMail & { verificationHours: number }): MailContent {
  return compose({
    subject: `The ${mail.applianceText} has been repaired`,
    greeting: `Hello ${mail.displayName},`,
    paragraphs: [
      `The technician has finished the repair of the ${mail.applianceText}.`,
      `${PRODUCT_NAME} now checks over the next ${mail.verificationHours} hours that it cools back down to its normal temperature; if it does not, the job is reopened without you having to call.`,
    ],
    action: { label: 'See the request', url: mail.url },
    notes: [MUTE_NOTE],
  });
}
