import { pgEnum } from 'drizzle-orm/pg-core';
import { ROLES } from '../../../shared/roles';

export const teamRole = pgEnum('team_role', ROLES);
