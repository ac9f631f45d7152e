import type { User } from '../models';

export function presentUser(user: User) {
  return { id: user.id, email: user.email, name: user.name, created_at: user.createdAt.toISOString() };
}

export type PresentedUser = ReturnType<typeof presentUser>;
