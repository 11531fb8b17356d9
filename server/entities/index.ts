// Every entity, registered with the one data source.
import { Appliance } from './appliance';
import { Organization } from './organization';
import { Property } from './property';
import { Sensor } from './sensor';
import { Unit } from './unit';
import { User } from './user';

export { Appliance, Organization, Property, Sensor, Unit, User };

export const ENTITIES = [Organization, User, Property, Unit, Appliance, Sensor];
