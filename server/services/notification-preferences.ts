/** Each person's e-mail choice: mute the messages that are not urgent. */
import type { DataSource } from 'typeorm';
import type { NotificationPreferenceView } from '../../shared/api/work-orders';
import type { Actor } from '../auth/actor';
import type { Clock } from '../auth/clock';

export class NotificationPreferencesService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly clock: Clock,
  ) {}

  async get(actor: Actor): Promise<NotificationPreferenceView> {
    const [row] = await this.dataSource.query(`SELECT mute_non_urgent FROM notification_preference WHERE user_id = $1`, [actor.id]);
    return { muteNonUrgent: row?.mute_non_urgent === true };
  }

  async set(actor: Actor, muteNonUrgent: boolean): Promise<NotificationPreferenceView> {
    await this.dataSource.query(
      `INSERT INTO notification_preference (user_id, mute_non_urgent, updated_at) VALUES ($1, $2, $3)
       ON CONFLICT (user_id) DO UPDATE SET mute_non_urgent = EXCLUDED.mute_non_urgent, updated_at = EXCLUDED.updated_at`,
      [actor.id, muteNonUrgent, this.clock.now()],
    );
    return { muteNonUrgent };
  }
}
