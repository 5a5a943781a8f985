import { AppError } from '@/lib/errors';
import type { Actor } from '@/lib/auth/actor';
import { roleCan, type Permission } from '@/lib/auth/permissions';

// Every service calls these before touching data: one place decides access.

export function can(actor: Actor, permission: Permission): boolean {
  return roleCan(actor.role, permission);
}

export function assertCan(actor: Actor, permission: Permission): void {
  if (!can(actor, permission)) throw new AppError('forbidden');
}
