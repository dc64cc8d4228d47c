import type { Bank, Site, Step } from '@varden/schemas';
import { useId, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { PanelSection } from '../components/panel-section';
import { ContactorForm, FuseSetForm, ReactorForm } from '../forms/component-forms';
import { controlClass } from '../forms/form-field';
import { StepForm } from '../forms/step-form';
import { newUnitDefaults, UnitForm } from '../forms/unit-form';
import type { BankRegister } from './bank-register';
import type { SymbolKind } from './panel-layout';

/** What the build panel adds, as the URL names it (?add=…&step=…). */
export const buildKinds = ['step', 'unit', 'contactor', 'reactor', 'fuse-set'] as const;
export type BuildKind = (typeof buildKinds)[number];

const kindLabels: Record<BuildKind, string> = {
  step: 'A step',
  unit: 'A capacitor unit',
  contactor: 'A contactor',
  reactor: 'A detuning reactor',
  'fuse-set': 'A fuse set',
};

/** The search that opens the build panel on a kind (and step); for links from the drawing. */
export function buildSearch(kind: BuildKind | SymbolKind, step?: Step): string {
  const search = new URLSearchParams({ add: kind });
  if (step) search.set('step', String(step.id));
  return `?${search.toString()}#build`;
}

const isBuildKind = (value: string | null): value is BuildKind => (buildKinds as readonly string[]).includes(value ?? '');

type BankBuildPanelProps = {
  bank: Bank;
  site: Site;
  register: BankRegister;
};

/**
 * "Build the bank": adds steps and their components one after another, the form staying open
 * with the next position or number suggested so a panel can be entered in one go.
 */
export function BankBuildPanel({ bank, site, register }: BankBuildPanelProps) {
  const [search, setSearch] = useSearchParams();
  const kindId = useId();
  const stepId = useId();
  // What was added last: the lists refresh a moment later, so the next suggestion starts from it.
  const [saved, setSaved] = useState<{ message: string; count: number; kind: BuildKind; stepId?: number; value?: number } | null>(null);
  // Without a choice in the URL: a step for an empty bank, else a unit; fixed on arrival so it
  // does not switch under the person once their first step is saved.
  const [fallbackKind] = useState<BuildKind>(register.steps.length === 0 ? 'step' : 'unit');
  const rawKind = search.get('add');
  const kind: BuildKind = isBuildKind(rawKind) ? rawKind : fallbackKind;
  const steps = [...register.steps].sort((a, b) => a.number - b.number);
  const chosenStep = steps.find((step) => String(step.id) === search.get('step')) ?? steps[0];

  const choose = (changes: { add?: BuildKind; step?: number }) => {
    setSearch(
      (previous) => {
        const next = new URLSearchParams(previous);
        if (changes.add) next.set('add', changes.add);
        if (changes.step) next.set('step', String(changes.step));
        return next;
      },
      { replace: true, preventScrollReset: true },
    );
    setSaved(null);
  };
  const done = (message: string, added: { stepId?: number; value?: number } = {}) =>
    setSaved((previous) => ({ message, count: (previous?.count ?? 0) + 1, kind, ...added }));
  const formKey = `${kind}-${chosenStep?.id ?? 0}-${saved?.count ?? 0}`;

  const lastAdded = (of: BuildKind, step?: Step) =>
    saved?.kind === of && (step === undefined || saved.stepId === step.id) ? (saved.value ?? 0) : 0;
  const nextStepNumber = Math.max(lastAdded('step'), ...steps.map((step) => step.number)) + 1;
  const lastStep = steps[steps.length - 1];
  const unitsOfStep = chosenStep ? register.componentsOf(chosenStep).units : [];
  const nextPosition = Math.max(lastAdded('unit', chosenStep), ...unitsOfStep.map((unit) => unit.position)) + 1;

  return (
    <PanelSection title="Build the bank" className="scroll-mt-4" data-print="hide">
      <div id="build" className="grid gap-6">
        <div className="grid gap-4 desk:grid-cols-2 desk:max-w-measure">
          <div className="grid gap-1">
            <label htmlFor={kindId} className="text-base font-medium desk:text-sm">
              Add
            </label>
            <select id={kindId} value={kind} onChange={(event) => choose({ add: event.target.value as BuildKind })} className={controlClass}>
              {buildKinds.map((value) => (
                <option key={value} value={value} disabled={value !== 'step' && steps.length === 0}>
                  {kindLabels[value]}
                </option>
              ))}
            </select>
          </div>
          {kind !== 'step' && chosenStep && (
            <div className="grid gap-1">
              <label htmlFor={stepId} className="text-base font-medium desk:text-sm">
                To step
              </label>
              <select id={stepId} value={chosenStep.id} onChange={(event) => choose({ step: Number(event.target.value) })} className={controlClass}>
                {steps.map((step) => (
                  <option key={step.id} value={step.id}>
                    Step {step.number} ({step.ratedKvar} kvar)
                  </option>
                ))}
              </select>
            </div>
          )}
        </div>

        {saved && (
          <p role="status" className="rounded border border-healthy bg-surface p-3">
            {saved.message}
          </p>
        )}

        {kind === 'step' && (
          <StepForm
            key={formKey}
            bankId={bank.id}
            suggested={{ number: nextStepNumber, ratedKvar: lastStep?.ratedKvar }}
            onSaved={(step) => done(`Step ${step.number} added (${step.ratedKvar} kvar). Add the next step, or its components.`, { value: step.number })}
          />
        )}
        {kind === 'unit' && chosenStep && (
          <UnitForm
            key={formKey}
            defaults={newUnitDefaults(chosenStep.id, site, nextPosition)}
            onSaved={(unit) =>
              done(`Capacitor unit at position ${unit.position} of step ${chosenStep.number} added: ${unit.ratedCapacitanceUF.toFixed(2)} µF rated.`, {
                stepId: chosenStep.id,
                value: unit.position,
              })
            }
          />
        )}
        {kind === 'contactor' && chosenStep && (
          <ContactorForm key={formKey} stepId={chosenStep.id} onSaved={() => done(`Contactor of step ${chosenStep.number} added.`)} />
        )}
        {kind === 'reactor' && chosenStep && (
          <ReactorForm
            key={formKey}
            stepId={chosenStep.id}
            detuningFactor={bank.detuningFactor}
            onSaved={() => done(`Detuning reactor of step ${chosenStep.number} added.`)}
          />
        )}
        {kind === 'fuse-set' && chosenStep && (
          <FuseSetForm key={formKey} stepId={chosenStep.id} onSaved={() => done(`Fuse set of step ${chosenStep.number} added.`)} />
        )}
      </div>
    </PanelSection>
  );
}
