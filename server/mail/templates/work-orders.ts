import { compose, PRODUCT_NAME, type MailContent } from './layout';

/** What a contractor needs to arrive with the right part: the job as an e-mail. */
export interface JobBrief {
  url: string;
  urgent: boolean;
  title: string;
  dueAt: string;
  propertyName: string;
  address: string;
  unitLabel: string | null;
  applianceText: string | null;
  /** Probable cause in plain words, with its temperature signature and confidence. */
  diagnosis: string | null;
  parts: string[];
  checks: string[];
  cautions: readonly string[];
  accessWindows: string[];
  petPresent: boolean;
  symptoms: string[];
}

function jobParagraphs(job: JobBrief): string[] {
  const where = [job.propertyName, job.address, job.unitLabel ? `unit ${job.unitLabel}` : null].filter(Boolean).join(', ');
  const lines = [`${job.urgent ? 'URGENT' : 'Routine'}: ${job.title}.`, `Where: ${where}.`, `Due by ${job.dueAt}.`];
  if (job.applianceText) lines.push(`Appliance: ${job.applianceText}.`);
  lines.push(job.diagnosis ? `Diagnosis from the temperature record: ${job.diagnosis}` : 'No diagnosis from the temperature record yet.');
  if (job.symptoms.length) lines.push(`The tenant reports: ${job.symptoms.join('; ')}.`);
  if (job.parts.length) lines.push(`Parts to bring: ${job.parts.join('; ')}.`);
  if (job.checks.length) lines.push(`Checks: ${job.checks.map((check, i) => `(${i + 1}) ${check}`).join(' ')}`);
  lines.push(job.accessWindows.length ? `Access: ${job.accessWindows.join('; ')}.` : 'Access: arrange with the property manager.');
  if (job.petPresent) lines.push('A pet lives in the unit.');
  lines.push(`Safety: ${job.cautions.join(' ')}`);
  return lines;
}

export function workOrderDispatchedMail(mail: { contractorName: string; job: JobBrief }): MailContent {
  return compose({
    subject: `${mail.job.urgent ? 'Urgent job' : 'New job'}: ${mail.job.title} at ${mail.job.propertyName}`,
    greeting: `Hello ${mail.contractorName},`,
    paragraphs: [`A work order has been dispatched to you through ${PRODUCT_NAME}. Please accept or decline it on its page.`, ...jobParagraphs(mail.job)],
    action: { label: 'Open the work order', url: mail.job.url },
  });
}

export function workOrderEscalatedToYouMail(mail: { contractorName: string; minutesUnaccepted: number; job: JobBrief }): MailContent {
  return compose({
    subject: `Urgent job passed to you: ${mail.job.title} at ${mail.job.propertyName}`,
    greeting: `Hello ${mail.contractorName},`,
    paragraphs: [
      `The primary contractor did not accept this urgent job within ${mail.minutesUnaccepted} minutes, so it comes to you as the backup.`,
      ...jobParagraphs(mail.job),
    ],
    action: { label: 'Open the work order', url: mail.job.url },
  });
}

export function workOrderReopenedMail(mail: { contractorName: string; windowHours: number; job: JobBrief }): MailContent {
  return compose({
    subject: `Reopened: ${mail.job.title} at ${mail.job.propertyName}`,
    greeting: `Hello ${mail.contractorName},`,
    paragraphs: [
      `After the work order was completed, the appliance did not pull back into its normal temperature range within ${mail.windowHours} hours, so the job is reopened. Please schedule a return visit.`,
      ...jobParagraphs(mail.job),
    ],
    action: { label: 'Open the work order', url: mail.job.url },
  });
}

export function workOrderCancelledMail(mail: { contractorName: string; title: string; propertyName: string; reason: string; url: string }): MailContent {
  return compose({
    subject: `Cancelled: ${mail.title} at ${mail.propertyName}`,
    greeting: `Hello ${mail.contractorName},`,
    paragraphs: [`The work order "${mail.title}" at ${mail.propertyName} is cancelled: ${mail.reason}`, 'No visit is needed.'],
    action: { label: 'See the work order', url: mail.url },
  });
}

/** The manager's notices: urgent incidents, power loss, escalations, declines, failed verification. */
export function managerNoticeMail(mail: { displayName: string; subject: string; paragraphs: string[]; url: string; actionLabel: string }): MailContent {
  return compose({
    subject: mail.subject,
    greeting: `Hello ${mail.displayName},`,
    paragraphs: mail.paragraphs,
    action: { label: mail.actionLabel, url: mail.url },
    notes: [`You receive this because you manage this property in ${PRODUCT_NAME}. Non-urgent messages can be muted on your profile page.`],
  });
}
