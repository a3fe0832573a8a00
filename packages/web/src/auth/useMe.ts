import { useQuery } from '@tanstack/react-query';
import { authQueries } from '../api/queries/authQueries.js';
import type { SessionUser } from '../api/types.js';

/** The signed-in user. Only used under the app layout, whose loader guarantees a session. */
export function useMe(): SessionUser {
  const { data } = useQuery(authQueries.me());
  if (!data) throw new Error('useMe used outside a signed-in route');
  return data;
}
