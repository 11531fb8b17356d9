// Every entity, registered with the one data source.
import { Appliance } from './appliance';
import { AuditEntry } from './audit-entry';
import { DetectionStyleSettings } from './detection-style-settings';
import { Invitation } from './invitation';
import { LoggerFile } from './logger-file';
import { Organization } from './organization';
import { PasswordReset } from './password-reset';
import { Property } from './property';
import { Sensor } from './sensor';
import { Unit } from './unit';
import { User } from './user';
import { WORK_ORDER_ENTITIES } from './work-order-entities';

export { Appliance, AuditEntry, DetectionStyleSettings, Invitation, LoggerFile, Organization, PasswordReset, Property, Sensor, Unit, User };

export const ENTITIES = [Organization, User, Property, Unit, Appliance, Sensor, Invitation, PasswordReset, AuditEntry, LoggerFile, DetectionStyleSettings, ...WORK_ORDER_ENTITIES];
