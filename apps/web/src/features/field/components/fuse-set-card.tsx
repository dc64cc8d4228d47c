import type { Reading, WalkthroughBank } from '@varden/schemas';
import { Controller, useWatch, type Path } from 'react-hook-form';
import { Button } from '../../../components/button';
import { blownFuses } from '../readings/live-component-results';
import { useComponentReading } from '../readings/use-component-reading';
import { ComponentCard } from './component-card';
import { ChoiceGroup, NotesField } from './field-controls';
import { OutboxItemStatus } from './outbox-item-status';
import { StoredReasons } from './stored-reasons';

type FuseSet = NonNullable<WalkthroughBank['steps'][number]['fuseSet']>;
type YesNo = 'yes' | 'no' | undefined;
type FuseForm = { fuse1: YesNo; fuse2: YesNo; fuse3: YesNo; rating: YesNo; notes: string };

const continuityOptions = [
  { value: 'yes', label: 'Continuity' },
  { value: 'no', label: 'Open (blown)' },
] as const;
const ratingOptions = [
  { value: 'yes', label: 'Matches' },
  { value: 'no', label: 'Does not match' },
] as const;

const yesNo = (v: unknown): YesNo => (v === true ? 'yes' : v === false ? 'no' : undefined);

function formFrom(input: Record<string, unknown> | undefined): FuseForm {
  const continuity = Array.isArray(input?.continuity) ? input.continuity : [];
  return { fuse1: yesNo(continuity[0]), fuse2: yesNo(continuity[1]), fuse3: yesNo(continuity[2]), rating: yesNo(input?.ratingMatchesRegister), notes: typeof input?.notes === 'string' ? input.notes : '' };
}

const fieldOf = ({ path }: { path: PropertyKey[] }): Path<FuseForm> | 'root' => {
  const [head, index] = path.map(String);
  if (head === 'continuity') return index === '1' ? 'fuse2' : index === '2' ? 'fuse3' : 'fuse1';
  if (head === 'ratingMatchesRegister') return 'rating';
  if (head === 'notes') return 'notes';
  return 'root';
};

const asBoolean = (v: YesNo) => (v === undefined ? undefined : v === 'yes') as boolean;

/** A step's fuse set: continuity of each of the three fuses, and whether their rating matches the register. */
export function FuseSetCard({ orderId, stepNumber, fuseSet, readings, editable }: { orderId: number; stepNumber: number; fuseSet: FuseSet; readings: readonly Reading[]; editable: boolean }) {
  const { form: methods, latestWaiting, latestStored, recorded, submitWith } = useComponentReading({
    orderId,
    target: 'fuse-set',
    targetId: fuseSet.id,
    readings,
    label: `Step ${stepNumber} fuses`,
    formFrom,
    fieldOf,
    messageOf: (issue) => (issue.path.length ? 'Choose one' : issue.message),
  });
  const { control, register, formState } = methods;
  const form = useWatch({ control }) as FuseForm;
  const blown = form.fuse1 && form.fuse2 && form.fuse3 ? blownFuses([form.fuse1 === 'yes', form.fuse2 === 'yes', form.fuse3 === 'yes']) : [];
  const errors = formState.errors;

  const onSubmit = submitWith((values, stamp) => ({
    ...stamp,
    target: 'fuse-set',
    targetId: fuseSet.id,
    continuity: [asBoolean(values.fuse1), asBoolean(values.fuse2), asBoolean(values.fuse3)],
    ratingMatchesRegister: asBoolean(values.rating),
    notes: values.notes.trim(),
  }));

  return (
    <ComponentCard
      title={`Step ${stepNumber} · Fuses`}
      testId={`fuse-set-${fuseSet.id}`}
      facts={
        <>
          Register: <span className="numeric">{fuseSet.ratedCurrentA} A</span> {fuseSet.type}
        </>
      }
    >
      <form onSubmit={(event) => void onSubmit(event)} noValidate className="grid gap-4">
        {(['fuse1', 'fuse2', 'fuse3'] as const).map((name, i) => (
          <Controller
            key={name}
            control={control}
            name={name}
            render={({ field }) => (
              <ChoiceGroup legend={`Fuse ${i + 1}`} options={continuityOptions} value={field.value} onChange={field.onChange} columns={2} error={errors[name]?.message} />
            )}
          />
        ))}
        {blown.length > 0 && (
          <p className="font-semibold text-replace" aria-live="polite">
            A blown fuse usually means a failed capacitor: investigate, don’t just re-fuse.
          </p>
        )}
        <Controller
          control={control}
          name="rating"
          render={({ field }) => (
            <ChoiceGroup legend={`Rating fitted vs the register’s ${fuseSet.ratedCurrentA} A`} options={ratingOptions} value={field.value} onChange={field.onChange} columns={2} error={errors.rating?.message} />
          )}
        />
        <NotesField disabled={!editable} error={errors.notes?.message} {...register('notes')} />
        {errors.root?.message && <p className="font-medium text-replace">{errors.root.message}</p>}
        {editable && (
          <Button type="submit" variant={recorded && !formState.isDirty ? 'secondary' : 'primary'} disabled={recorded && !formState.isDirty} className="w-full desk:w-auto">
            {recorded ? (formState.isDirty ? 'Record again' : 'Recorded') : 'Record fuses'}
          </Button>
        )}
        <OutboxItemStatus item={latestWaiting} storedAt={latestStored?.recordedAt} />
        {!latestWaiting && <StoredReasons reading={latestStored} />}
      </form>
    </ComponentCard>
  );
}
