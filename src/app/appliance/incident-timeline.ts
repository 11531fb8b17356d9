import { ChangeDetectionStrategy, Component, computed, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import type { IncidentWithFindings } from '../../../shared/api/appliances';
import { CAUSES } from '../../../shared/causes';
import type { Compartment } from '../../../shared/domain';
import { KIND_LABELS, SEVERITY_LABELS } from '../fleet/appliance-words';
import { ZonedDatePipe } from '../fleet/zoned-date';

export interface TimelineEntry {
  atMs: number;
  at: string;
  icon: string;
  text: string;
  detail: string;
}

export interface TimelineIncident {
  incident: IncidentWithFindings;
  title: string;
  entries: TimelineEntry[];
}

const COMPARTMENT_WORDS: Record<Compartment, string> = { fresh_food: 'fresh food', freezer: 'freezer', both: 'both sections' };
export const TIMELINE_FIRST_SHOWN = 4;

/** One incident's story in time order: the onset, each finding, the opening, the recovery. */
export function timelineOf(incident: IncidentWithFindings): TimelineEntry[] {
  const entry = (at: string, icon: string, text: string, detail = ''): TimelineEntry => ({ atMs: Date.parse(at), at, icon, text, detail });
  const entries = [entry(incident.startedAt, 'flag', 'Trouble began (estimated)')];
  // A finding opens its incident: at the same instant, the finding comes first (the sort is stable).
  for (const finding of incident.findings) entries.push(entry(finding.detectedAt, 'insights', `${KIND_LABELS[finding.kind]} detected in the ${COMPARTMENT_WORDS[finding.compartment]}`, finding.summary));
  entries.push(entry(incident.openedAt, 'notification_important', `Incident opened, ${SEVERITY_LABELS[incident.severity]}`));
  for (const finding of incident.findings) if (finding.endedAt) entries.push(entry(finding.endedAt, 'check', `${KIND_LABELS[finding.kind]} ended`));
  if (incident.closedAt) entries.push(entry(incident.closedAt, 'task_alt', 'Recovered: incident closed'));
  return entries.sort((a, b) => a.atMs - b.atMs);
}

/** The appliance's incidents, most recent first, each as a timeline. */
@Component({
  selector: 'cw-incident-timeline',
  imports: [MatButtonModule, MatCardModule, MatIconModule, ZonedDatePipe],
  templateUrl: './incident-timeline.html',
  styleUrl: './incident-timeline.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class IncidentTimeline {
  readonly incidents = input<IncidentWithFindings[]>([]);
  readonly timeZone = input<string | null>(null);

  protected readonly showAll = signal(false);
  protected readonly items = computed<TimelineIncident[]>(() =>
    this.incidents().map((incident) => ({
      incident,
      title: `${KIND_LABELS[incident.kind]}${incident.topCause ? ` — ${CAUSES[incident.topCause].title.toLowerCase()}` : ''}`,
      entries: timelineOf(incident),
    })),
  );
  protected readonly visible = computed(() => (this.showAll() ? this.items() : this.items().slice(0, TIMELINE_FIRST_SHOWN)));
}
