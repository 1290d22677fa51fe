import type { Role } from '@/shared/schemas/auth';

/** Who is asking: every use case is told, and scopes its data by organisation. */
export interface Actor {
  userId: string;
  organizationId: string;
  role: Role;
}
