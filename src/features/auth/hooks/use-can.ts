import { can, type Permission } from '@shared/permissions';
import { useMe } from './use-me';

/** Hides controls only: the server checks the same permission and refuses regardless of what the UI shows. */
export function useCan(permission: Permission): boolean {
  const { user } = useMe();
  return user ? can(user.roles, permission) : false;
}
