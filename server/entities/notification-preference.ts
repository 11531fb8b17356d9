import { Column, Entity, PrimaryColumn } from 'typeorm';

/** A person's e-mail choices: urgent messages always go out. */
@Entity({ name: 'notification_preference' })
export class NotificationPreference {
  @PrimaryColumn({ name: 'user_id', type: 'uuid' })
  userId: string;

  @Column({ name: 'mute_non_urgent', type: 'boolean', default: false })
  muteNonUrgent: boolean;

  @Column({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
