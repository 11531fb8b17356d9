// Migrations in the order they run. Add a new one at the end (see DEVELOPERS.md).
import { CoreSchema1764633600000 } from './1764633600000-core-schema';

export const MIGRATIONS = [CoreSchema1764633600000];
