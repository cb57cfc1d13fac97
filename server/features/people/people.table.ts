import type { Generated } from 'kysely';
import type { Role } from '../../../shared/auth/roles';

export interface UserTable {
  id: string;
  email: string;
  name: string;
  passwordHash: string;
  active: Generated<number>;
  preferencesJson: Generated<string>;
  createdAt: string;
}

export interface UserRoleTable {
  userId: string;
  role: Role;
}

export interface SessionTable {
  id: string;
  expiresAt: number;
  userId: string;
}
