import type { WorkOrderDetail } from '@varden/schemas';
import { CapacitorUnitCard } from './capacitor-unit-card';
import { ContactorCard } from './contactor-card';
import { FuseSetCard } from './fuse-set-card';
import { ReactorCard } from './reactor-card';
import { partsOfStep } from './step-parts';

type Step = WorkOrderDetail['bank']['steps'][number];

/** One step of the walk: each of its components the checklist asks for, in the order they are built. */
export function WalkStep({ order, step, editable }: { order: WorkOrderDetail; step: Step; editable: boolean }) {
  const parts = partsOfStep(step, order.checklist);
  const readingsOf = (target: string, id: number) => order.readings.filter((r) => r.target === target && r.targetId === id);
  const place = {
    detuned: order.bank.detuned,
    detuningFactor: order.bank.detuningFactor,
    siteFrequencyHz: order.bank.siteFrequencyHz,
    reactorInductanceMH: step.reactor?.inductanceMH ?? null,
    unitsInStep: step.units.length,
  };
  const nothing = parts.units.length === 0 && !parts.contactor && !parts.reactor && !parts.fuseSet;
  return (
    <div className="grid gap-4">
      {nothing && <p className="text-ink-muted">This order’s checklist asks for nothing on step {step.number}.</p>}
      {parts.units.map((unit) => (
        <CapacitorUnitCard
          key={unit.id}
          orderId={order.id}
          stepNumber={step.number}
          unit={unit}
          place={place}
          checklist={order.checklist}
          readings={readingsOf('capacitor-unit', unit.id)}
          photos={order.photos}
          editable={editable}
        />
      ))}
      {parts.contactor && <ContactorCard orderId={order.id} stepNumber={step.number} contactor={parts.contactor} readings={readingsOf('contactor', parts.contactor.id)} editable={editable} />}
      {parts.reactor && <ReactorCard orderId={order.id} stepNumber={step.number} reactor={parts.reactor} readings={readingsOf('reactor', parts.reactor.id)} editable={editable} />}
      {parts.fuseSet && <FuseSetCard orderId={order.id} stepNumber={step.number} fuseSet={parts.fuseSet} readings={readingsOf('fuse-set', parts.fuseSet.id)} editable={editable} />}
    </div>
  );
}
