// The client hides what a role cannot do, from the same table the API enforces.
import { can, type Permission } from '@bumperline/contracts/roles';
import { useMe } from './me.ts';

export function useCan(permission: Permission): boolean {
  const me = useMe();
  return can(me.data?.role, permission);
}
