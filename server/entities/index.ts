// Every entity, registered with the one data source.
import { Appliance } from './appliance';
import { AuditEntry } from './audit-entry';
import { Invitation } from './invitation';
import { Organization } from './organization';
import { PasswordReset } from './password-reset';
import { Property } from './property';
import { Sensor } from './sensor';
import { Unit } from './unit';
import { User } from './user';

export { Appliance, AuditEntry, Invitation, Organization, PasswordReset, Property, Sensor, Unit, User };

export const ENTITIES = [Organization, User, Property, Unit, Appliance, Sensor, Invitation, PasswordReset, AuditEntry];
