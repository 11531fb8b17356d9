import type { Request, Response } from 'express';
import type { DetectionOverrides } from '../../shared/api/settings';
import type { ApplianceStyle } from '../../shared/domain';
import { actorOf } from '../auth/actor';
import type { DetectionSettingsService } from '../services/detection-settings';

export function detectionSettingsController(settings: DetectionSettingsService) {
  const style = (req: Request) => req.params.style as ApplianceStyle;
  return {
    view: async (req: Request, res: Response) => {
      res.json(await settings.view(actorOf(req)));
    },
    replace: async (req: Request, res: Response) => {
      const body: DetectionOverrides = req.body;
      res.json(await settings.replace(actorOf(req), style(req), body));
    },
    reset: async (req: Request, res: Response) => {
      res.json(await settings.reset(actorOf(req), style(req)));
    },
  };
}
