import type { Step, Unit } from '@varden/schemas';
import { useQuery, useSuspenseQuery, type QueryClient } from '@tanstack/react-query';
import { componentQueries, type Contactor, type FuseSet, type Reactor } from '../api/component-queries';
import { stepQueries } from '../api/step-queries';
import { unitQueries } from '../api/unit-queries';
import { componentsByStep, type StepComponents } from './panel-layout';

/** Everything in service in one bank, as the panel drawing and its table need it. */
export type BankRegister = {
  steps: Step[];
  units: Unit[];
  contactors: Contactor[];
  reactors: Reactor[];
  fuseSets: FuseSet[];
  componentsOf: (step: Step) => StepComponents;
  /** True while any part is still loading (steps come first, from the route's loader). */
  loading: boolean;
  failed: boolean;
};

/** Starts loading a bank's components, for a loader that does not wait for them. */
export function prefetchBankComponents(queryClient: QueryClient, bankId: number): void {
  void queryClient.prefetchQuery(unitQueries.list({ bankId, includeRemoved: false }));
  void queryClient.prefetchQuery(componentQueries.ofBank('contactors', bankId));
  void queryClient.prefetchQuery(componentQueries.ofBank('reactors', bankId));
  void queryClient.prefetchQuery(componentQueries.ofBank('fuse-sets', bankId));
}

export function useBankRegister(bankId: number): BankRegister {
  const steps = useSuspenseQuery(stepQueries.ofBank(bankId)).data.items;
  const units = useQuery(unitQueries.list({ bankId, includeRemoved: false }));
  const contactors = useQuery(componentQueries.ofBank('contactors', bankId));
  const reactors = useQuery(componentQueries.ofBank('reactors', bankId));
  const fuseSets = useQuery(componentQueries.ofBank('fuse-sets', bankId));
  const parts = [units, contactors, reactors, fuseSets];
  const all = {
    units: units.data?.items ?? [],
    contactors: contactors.data?.items ?? [],
    reactors: reactors.data?.items ?? [],
    fuseSets: fuseSets.data?.items ?? [],
  };
  return {
    steps,
    ...all,
    componentsOf: componentsByStep(all),
    loading: parts.some((part) => part.isPending),
    failed: parts.some((part) => part.isError),
  };
}
