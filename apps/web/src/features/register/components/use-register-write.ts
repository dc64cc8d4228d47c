import { useQuery } from '@tanstack/react-query';
import { hasPermission, session } from '../../auth/api/session-queries';

/** Whether the signed-in person may change the register; write commands hide when not. The server decides anyway. */
export function useCanWriteRegister(): boolean {
  const { data } = useQuery(session);
  return hasPermission(data, 'register:write');
}
