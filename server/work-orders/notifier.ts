/**
 * The work-order loop's e-mails: who gets which message, and muting. Urgent messages
 * always go out; a person who muted non-urgent e-mail gets only those. A contractor
 * company's dispatch address is not a person and is never muted. Sending never fails
 * the action that caused it: a mail error is logged.
 */
import type { Logger } from 'pino';
import type { DataSource } from 'typeorm';
import { causeInfo, SAFETY_CAUTIONS } from '../../shared/causes';
import { SYMPTOMS, type Symptom } from '../../shared/api/tenant';
import type { Mailer } from '../mail/mailer';
import {
  managerNoticeMail,
  repairCompletedMail,
  requestConfirmedMail,
  troubleNoticedMail,
  visitScheduledMail,
  workOrderCancelledMail,
  workOrderDispatchedMail,
  workOrderEscalatedToYouMail,
  workOrderReopenedMail,
  type JobBrief,
  type MailContent,
} from '../mail/templates';
import { foodSafetyGuidance } from './food-safety';
import { applianceWords, loadJobContext, loadRequestContext, localTime, type JobContext, type RequestContext } from './job-context';

interface Recipient {
  email: string;
  displayName: string;
  userId: string | null;
}

export interface NotifierDeps {
  dataSource: DataSource;
  mailer: Mailer;
  publicUrl: string;
  logger: Logger;
}

function diagnosisText(context: RequestContext): string | null {
  const top = context.probableCauses[0];
  if (!top) return null;
  const info = causeInfo(top.code);
  return `${info.title} (about ${Math.round(top.confidence * 100)} % likely). ${info.signature}`;
}

function applianceText(context: RequestContext): string | null {
  if (!context.style) return null;
  const plate = [context.model && `model ${context.model}`, context.serial && `serial ${context.serial}`].filter(Boolean).join(', ');
  return `${applianceWords(context.style)}${plate ? ` (${plate})` : ''}`;
}

function symptomWords(symptoms: string[]): string[] {
  return symptoms.map((code) => SYMPTOMS[code as Symptom] ?? code);
}

export class WorkOrderNotifier {
  constructor(private readonly deps: NotifierDeps) {}

  pageUrl(path: string): string {
    return new URL(path, this.deps.publicUrl).toString();
  }

  // ── contractor ──────────────────────────────────────────────────────────────────

  async dispatched(workOrderId: string): Promise<void> {
    const job = await this.job(workOrderId);
    if (!job) return;
    const content = workOrderDispatchedMail({ contractorName: job.context.contractorName, job: job.brief });
    await this.toContractor(job.context, content, job.brief.urgent);
  }

  async escalatedToBackup(workOrderId: string, minutesUnaccepted: number, fromContractorName: string): Promise<void> {
    const job = await this.job(workOrderId);
    if (!job) return;
    await this.toContractor(job.context, workOrderEscalatedToYouMail({ contractorName: job.context.contractorName, minutesUnaccepted, job: job.brief }), true);
    await this.toManagers(job.context, true, {
      subject: `Escalated to the backup contractor: ${job.context.title} at ${job.context.propertyName}`,
      paragraphs: [`${fromContractorName} did not accept this urgent job within ${minutesUnaccepted} minutes. It has been passed to ${job.context.contractorName}, the backup contractor.`],
      url: this.pageUrl(`/work-orders/${workOrderId}`),
      actionLabel: 'Open the work order',
    });
  }

  async escalationWithoutBackup(workOrderId: string, minutesUnaccepted: number): Promise<void> {
    const job = await this.job(workOrderId);
    if (!job) return;
    await this.toManagers(job.context, true, {
      subject: `Nobody has accepted an urgent job: ${job.context.title} at ${job.context.propertyName}`,
      paragraphs: [`${job.context.contractorName} did not accept this urgent job within ${minutesUnaccepted} minutes, and no backup contractor covers this property and appliance. Please assign it by hand.`],
      url: this.pageUrl(`/work-orders/${workOrderId}`),
      actionLabel: 'Open the work order',
    });
  }

  async reopened(workOrderId: string, windowHours: number): Promise<void> {
    const job = await this.job(workOrderId);
    if (!job) return;
    await this.toContractor(job.context, workOrderReopenedMail({ contractorName: job.context.contractorName, windowHours, job: job.brief }), true);
    await this.toManagers(job.context, true, {
      subject: `Repair did not hold: ${job.context.title} at ${job.context.propertyName}`,
      paragraphs: [
        `After ${job.context.contractorName} completed the work order, the appliance did not pull back into its normal range within ${windowHours} hours. The work order is reopened and counts against first-visit fix.`,
      ],
      url: this.pageUrl(`/work-orders/${workOrderId}`),
      actionLabel: 'Open the work order',
    });
  }

  async cancelled(workOrderId: string, reason: string): Promise<void> {
    const job = await this.job(workOrderId);
    if (!job) return;
    const { context } = job;
    const content = workOrderCancelledMail({ contractorName: context.contractorName, title: context.title, propertyName: context.propertyName, reason, url: this.pageUrl(`/work-orders/${workOrderId}`) });
    await this.toContractor(context, content, true);
  }

  // ── manager ─────────────────────────────────────────────────────────────────────

  async declined(workOrderId: string, reason: string, reassigned: string | null): Promise<void> {
    const job = await this.job(workOrderId);
    if (!job) return;
    const next = reassigned ? `It has been passed to ${reassigned}, the backup contractor.` : 'Please assign it to another contractor.';
    await this.toManagers(job.context, job.brief.urgent, {
      subject: `Declined: ${job.context.title} at ${job.context.propertyName}`,
      paragraphs: [`${job.context.contractorName} declined the work order: ${reason}`, next],
      url: this.pageUrl(`/service-requests/${job.context.requestId}`),
      actionLabel: 'Open the request',
    });
  }

  /** A request opened by the monitor or a manager; `undispatched` says why no contractor was sent. */
  async requestOpened(requestId: string, undispatched: string | null): Promise<void> {
    const context = await loadRequestContext(this.deps.dataSource, requestId);
    if (!context) return;
    const urgent = context.priority === 'urgent';
    if (urgent || undispatched) {
      const diagnosis = diagnosisText(context);
      await this.toManagers(context, urgent, {
        subject: `${urgent ? 'Urgent' : 'New'}: ${context.title} at ${context.propertyName}${context.unitLabel ? `, unit ${context.unitLabel}` : ''}`,
        paragraphs: [
          `A service request is open for the ${applianceWords(context.style)}${context.unitLabel ? ` in unit ${context.unitLabel}` : ''}.`,
          ...(diagnosis ? [`Probable cause: ${diagnosis}`] : []),
          undispatched ?? 'The covering contractor has been dispatched.',
        ],
        url: this.pageUrl(`/service-requests/${requestId}`),
        actionLabel: 'Open the request',
      });
    }
    if (urgent && context.source === 'monitor') await this.troubleNoticed(context);
  }

  async powerLoss(requestId: string): Promise<void> {
    const context = await loadRequestContext(this.deps.dataSource, requestId);
    if (!context) return;
    await this.toManagers(context, true, {
      subject: `Power loss at ${context.propertyName}: ${context.applianceCount} appliances warming together`,
      paragraphs: [
        `${context.applianceCount} appliances at ${context.propertyName} started warming at the same time: the power supply, not the appliances. No technician has been sent to the units.`,
        'Check the breaker or fuse and the utility before sending anyone, and ask tenants to keep the doors closed: a closed refrigerator keeps food safe about 4 hours, a full freezer about 48 hours (USDA FSIS).',
      ],
      url: this.pageUrl(`/service-requests/${requestId}`),
      actionLabel: 'Open the request',
    });
  }

  async tenantReport(requestId: string, reporterUserId: string, attached: boolean): Promise<void> {
    const context = await loadRequestContext(this.deps.dataSource, requestId);
    if (!context) return;
    const reporter = await this.user(reporterUserId);
    if (reporter) {
      const content = requestConfirmedMail({ displayName: reporter.displayName, applianceText: applianceWords(context.style), url: this.pageUrl('/home'), attached });
      await this.send(reporter, content, false);
    }
    const urgent = context.priority === 'urgent';
    await this.toManagers(context, urgent, {
      subject: `${attached ? 'Tenant report added' : 'Tenant report'}: ${context.title} at ${context.propertyName}${context.unitLabel ? `, unit ${context.unitLabel}` : ''}`,
      paragraphs: [
        `The tenant reports: ${symptomWords(context.symptoms).join('; ')}.`,
        attached ? 'It was added to the request already open for this appliance.' : 'No contractor has been dispatched yet: dispatch it from the request page.',
      ],
      url: this.pageUrl(`/service-requests/${requestId}`),
      actionLabel: 'Open the request',
    });
  }

  // ── tenant ──────────────────────────────────────────────────────────────────────

  async visitScheduled(workOrderId: string): Promise<void> {
    const job = await this.job(workOrderId);
    if (!job?.context.scheduledStartAt || !job.context.scheduledEndAt) return;
    const { context } = job;
    const window = `between ${localTime(context.scheduledStartAt as Date, context.timeZone)} and ${localTime(context.scheduledEndAt as Date, context.timeZone)}`;
    for (const tenant of await this.tenantsOf(context)) {
      await this.send(tenant, visitScheduledMail({ displayName: tenant.displayName, applianceText: applianceWords(context.style), url: this.pageUrl('/home'), window, contractorName: context.contractorName }), false);
    }
  }

  async completed(workOrderId: string, verificationHours: number): Promise<void> {
    const job = await this.job(workOrderId);
    if (!job) return;
    for (const tenant of await this.tenantsOf(job.context)) {
      await this.send(tenant, repairCompletedMail({ displayName: tenant.displayName, applianceText: applianceWords(job.context.style), url: this.pageUrl('/home'), verificationHours }), false);
    }
  }

  private async troubleNoticed(context: RequestContext): Promise<void> {
    const guidance = foodSafetyGuidance('warm', context.minutesAbove4c);
    for (const tenant of await this.tenantsOf(context)) {
      const content = troubleNoticedMail({ displayName: tenant.displayName, applianceText: applianceWords(context.style), url: this.pageUrl('/home'), guidance: [guidance.headline, ...guidance.advice, ...guidance.sources] });
      await this.send(tenant, content, true);
    }
  }

  // ── recipients and sending ───────────────────────────────────────────────────────

  private async job(workOrderId: string): Promise<{ context: JobContext; brief: JobBrief } | null> {
    const context = await loadJobContext(this.deps.dataSource, workOrderId);
    if (!context) return null;
    const info = context.topCause ? causeInfo(context.topCause) : null;
    const brief: JobBrief = {
      url: this.pageUrl(`/work-orders/${workOrderId}`),
      urgent: context.workPriority === 'urgent',
      title: context.title,
      dueAt: localTime(context.dueAt, context.timeZone),
      propertyName: context.propertyName,
      address: context.address,
      unitLabel: context.unitLabel,
      applianceText: applianceText(context),
      diagnosis: diagnosisText(context),
      parts: info?.parts ?? [],
      checks: info?.checks ?? [],
      cautions: SAFETY_CAUTIONS,
      accessWindows: context.accessWindows.map((w) => `${localTime(w.from, context.timeZone)} to ${localTime(w.to, context.timeZone)}`),
      petPresent: context.petPresent,
      symptoms: symptomWords(context.symptoms),
    };
    return { context, brief };
  }

  private async toContractor(context: JobContext, content: MailContent, urgent: boolean): Promise<void> {
    const members: Recipient[] = await this.people(
      `SELECT u.id, u.email, u.display_name FROM contractor_member m JOIN app_user u ON u.id = m.user_id WHERE m.contractor_id = $1 AND u.deactivated_at IS NULL`,
      [context.contractorId],
    );
    const company: Recipient = { email: context.contractorEmail, displayName: context.contractorName, userId: null };
    const seen = new Set<string>();
    for (const recipient of [company, ...members]) {
      if (seen.has(recipient.email.toLowerCase())) continue;
      seen.add(recipient.email.toLowerCase());
      await this.send(recipient, content, urgent);
    }
  }

  private async toManagers(context: RequestContext, urgent: boolean, notice: { subject: string; paragraphs: string[]; url: string; actionLabel: string }): Promise<void> {
    const managers = await this.people(`SELECT id, email, display_name FROM app_user WHERE organization_id = $1 AND role = 'manager' AND deactivated_at IS NULL`, [context.organizationId]);
    for (const manager of managers) await this.send(manager, managerNoticeMail({ displayName: manager.displayName, ...notice }), urgent);
  }

  private tenantsOf(context: RequestContext): Promise<Recipient[]> {
    if (!context.unitId) return Promise.resolve([]);
    return this.people(`SELECT id, email, display_name FROM app_user WHERE unit_id = $1 AND role = 'tenant' AND deactivated_at IS NULL`, [context.unitId]);
  }

  private async user(userId: string): Promise<Recipient | null> {
    const [person] = await this.people(`SELECT id, email, display_name FROM app_user WHERE id = $1 AND deactivated_at IS NULL`, [userId]);
    return person ?? null;
  }

  private async people(sql: string, params: unknown[]): Promise<Recipient[]> {
    const rows: { id: string; email: string; display_name: string }[] = await this.deps.dataSource.query(sql, params);
    return rows.map((row) => ({ userId: row.id, email: row.email, displayName: row.display_name }));
  }

  private async muted(userId: string | null): Promise<boolean> {
    if (!userId) return false;
    const [row] = await this.deps.dataSource.query(`SELECT mute_non_urgent FROM notification_preference WHERE user_id = $1`, [userId]);
    return row?.mute_non_urgent === true;
  }

  private async send(to: Recipient, content: MailContent, urgent: boolean): Promise<void> {
    if (!urgent && (await this.muted(to.userId))) return;
    try {
      await this.deps.mailer.send({ to: to.email, ...content });
    } catch (error) {
      this.deps.logger.warn({ err: error, subject: content.subject }, 'work orders: an e-mail could not be sent');
    }
  }
}
