import type { ReactNode } from 'react';
import { useCanWriteRegister } from './use-register-write';

/** Shows its children only to people who may change the register. */
export function RegisterWriteOnly({ children }: { children: ReactNode }) {
  return useCanWriteRegister() ? <>{children}</> : null;
}
