import type { Request, Response } from 'express';
import type { IncidentQuery } from '../../shared/api/monitor';
import { actorOf } from '../auth/actor';
import type { AttachmentsService } from '../services/attachments';
import type { IncidentsService } from '../services/incidents';
import type { NotificationPreferencesService } from '../services/notification-preferences';
import type { OrgSettingsService } from '../work-orders/org-settings';

export function incidentsController(incidents: IncidentsService) {
  return {
    list: async (req: Request, res: Response) => {
      res.json(await incidents.list(actorOf(req), req.query as unknown as IncidentQuery));
    },
    get: async (req: Request, res: Response) => {
      res.json(await incidents.get(actorOf(req), req.params.incidentId as string));
    },
  };
}

export function attachmentsController(attachments: AttachmentsService) {
  return {
    original: async (req: Request, res: Response) => {
      await attachments.stream(actorOf(req), req.params.attachmentId as string, 'original', res);
    },
    thumbnail: async (req: Request, res: Response) => {
      await attachments.stream(actorOf(req), req.params.attachmentId as string, 'thumbnail', res);
    },
  };
}

export function orgSettingsController(settings: OrgSettingsService) {
  return {
    get: async (req: Request, res: Response) => {
      res.json(await settings.view(actorOf(req)));
    },
    update: async (req: Request, res: Response) => {
      res.json(await settings.update(actorOf(req), req.body));
    },
  };
}

export function notificationPreferencesController(preferences: NotificationPreferencesService) {
  return {
    get: async (req: Request, res: Response) => {
      res.json(await preferences.get(actorOf(req)));
    },
    set: async (req: Request, res: Response) => {
      res.json(await preferences.set(actorOf(req), req.body.muteNonUrgent));
    },
  };
}
