import type { Role } from '../domain';
import type { TemperatureUnit } from '../temperature';

/** The signed-in person as `GET /api/auth/me` returns it. */
export interface SessionUser {
  id: string;
  email: string;
  displayName: string;
  role: Role;
  isAdmin: boolean;
  organizationId: string | null;
  unitId: string | null;
  temperatureUnit: TemperatureUnit;
  timeZone: string | null;
}
