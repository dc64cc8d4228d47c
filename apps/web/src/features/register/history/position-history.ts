import type { Unit } from '@varden/schemas';

/**
 * Every unit that has stood at one position of a step, oldest first, following the replacement
 * chain (each removed unit's replacedById names its successor). Units at the position outside
 * the chain (added by hand after a removal) keep their installation order around it.
 */
export function positionHistory(units: readonly Unit[], current: Pick<Unit, 'id' | 'stepId' | 'position'>): Unit[] {
  const atPosition = units.filter((unit) => unit.stepId === current.stepId && unit.position === current.position);
  const byId = new Map(atPosition.map((unit) => [unit.id, unit]));
  const predecessorOf = new Map<number, Unit>();
  for (const unit of atPosition) if (unit.replacedById !== null) predecessorOf.set(unit.replacedById, unit);

  const chain: Unit[] = [];
  const seen = new Set<number>();
  // Back to the first unit of the chain, then forward along replacedById; `seen` stops a loop in bad data.
  let first = byId.get(current.id);
  while (first && predecessorOf.has(first.id) && !seen.has(first.id)) {
    seen.add(first.id);
    first = predecessorOf.get(first.id);
  }
  seen.clear();
  for (let unit = first; unit && !seen.has(unit.id); unit = unit.replacedById === null ? undefined : byId.get(unit.replacedById)) {
    seen.add(unit.id);
    chain.push(unit);
  }

  const installed = (unit: Unit) => unit.installedOn ?? unit.removedOn ?? '';
  const others = atPosition.filter((unit) => !seen.has(unit.id));
  return [...chain, ...others].sort((a, b) => {
    const inChain = seen.has(a.id) && seen.has(b.id);
    if (inChain) return chain.indexOf(a) - chain.indexOf(b);
    return installed(a).localeCompare(installed(b)) || a.id - b.id;
  });
}
