import { connections } from '@varden/schemas';
import { get, useFormContext, useWatch, type FieldError, type FieldValues } from 'react-hook-form';
import { Quantity } from '../../../components/quantity';
import {
  capacitanceBasis,
  capacitanceWarningPct,
  compareCapacitance,
  ratedCapacitancePreview,
} from '../nameplate/capacitance-preview';
import { DateField, FieldGroup, NumberField, SelectField, TextField } from './form-field';
import { asNullableNumber, asNullableText, asNumber } from './form-values';
import { readerLocale } from '../../../lib/reader-format';

/** The fields of a capacitor unit that this component edits (the shared unitCreate schema's, less stepId). */
type UnitField =
  | 'position'
  | 'nameplateKvar'
  | 'nameplateVoltageV'
  | 'nameplateFrequencyHz'
  | 'connection'
  | 'capacitanceUF'
  | 'tolerancePreset'
  | 'toleranceMinusPct'
  | 'tolerancePlusPct'
  | 'temperatureCategory'
  | 'dischargeTimeS'
  | 'serial'
  | 'maker'
  | 'model'
  | 'installedOn';

export const connectionLabels: Record<(typeof connections)[number], string> = {
  delta: 'Delta (three-phase)',
  star: 'Star (three-phase)',
  'single-phase': 'Single-phase',
};

export const tolerancePresetLabels = {
  iec: 'IEC 60831-1: −5 % to +10 %',
  ieee: 'IEEE 18: 0 % to +10 %',
  custom: 'Custom limits',
} as const;

type UnitFieldsProps = {
  /** '' when the form is the unit itself; 'replacement.' inside the replacement form. */
  prefix?: '' | 'replacement.';
  /** A replacement takes its position from the unit it replaces. */
  withPosition?: boolean;
};

/**
 * A capacitor unit's nameplate and record fields, with its rated capacitance worked out in the
 * browser as the nameplate is typed and the difference of a typed capacitance shown beside it.
 * Lives inside a react-hook-form FormProvider whose values follow the shared unit schemas.
 */
export function UnitFields({ prefix = '', withPosition = true }: UnitFieldsProps) {
  const { register, control, formState } = useFormContext<FieldValues>();
  const name = (field: UnitField) => `${prefix}${field}`;
  const errorOf = (field: UnitField): FieldError | undefined => get(formState.errors, name(field)) as FieldError | undefined;

  const [kvar, voltageV, frequencyHz, connection, capacitanceUF, tolerancePreset] = useWatch({
    control,
    name: ['nameplateKvar', 'nameplateVoltageV', 'nameplateFrequencyHz', 'connection', 'capacitanceUF', 'tolerancePreset'].map((field) =>
      name(field as UnitField),
    ),
  }) as unknown[];
  const ratedUF = ratedCapacitancePreview({ kvar, voltageV, frequencyHz, connection });
  const comparison = compareCapacitance(capacitanceUF, ratedUF);
  const basis = capacitanceBasis(connection);

  return (
    <div className="grid gap-8">
      <FieldGroup legend="Nameplate" columns={3}>
        {withPosition && (
          <NumberField
            label="Position in the step"
            hint="From 1, as fitted in the step"
            registration={register(name('position'), { setValueAs: asNumber })}
            error={errorOf('position')}
            input={{ inputMode: 'numeric' }}
          />
        )}
        <NumberField label="Rated output" unit="kvar" registration={register(name('nameplateKvar'), { setValueAs: asNumber })} error={errorOf('nameplateKvar')} />
        <NumberField
          label="Rated voltage"
          unit="V"
          registration={register(name('nameplateVoltageV'), { setValueAs: asNumber })}
          error={errorOf('nameplateVoltageV')}
        />
        <SelectField
          label="Rated frequency"
          unit="Hz"
          registration={register(name('nameplateFrequencyHz'), { setValueAs: Number })}
          error={errorOf('nameplateFrequencyHz')}
          options={[
            { value: '50', label: '50' },
            { value: '60', label: '60' },
          ]}
        />
        <SelectField
          label="Connection"
          registration={register(name('connection'))}
          error={errorOf('connection')}
          options={connections.map((value) => ({ value, label: connectionLabels[value] }))}
        />
      </FieldGroup>

      <div data-testid="rated-capacitance-preview" aria-live="polite" className="rounded-md border border-line bg-sunken p-4">
        <p className="text-base font-medium desk:text-sm">Rated capacitance from the nameplate</p>
        {ratedUF === null ? (
          <p className="mt-1 text-ink-muted">Shown here once the rated output, voltage, frequency and connection are filled in.</p>
        ) : (
          <p className="mt-1 text-lg">
            <Quantity value={ratedUF} unit="µF" /> <span className="text-base text-ink-muted">{basis}</span>
          </p>
        )}
      </div>

      <FieldGroup legend="Capacitance and tolerance" columns={3}>
        <NumberField
          label="Capacitance as marked"
          unit="µF"
          hint={`Optional: ${basis || 'per leg, phase or element'}. Left empty, the nameplate's value is used.`}
          registration={register(name('capacitanceUF'), { setValueAs: asNullableNumber })}
          error={errorOf('capacitanceUF')}
          live={
            comparison && (
              <p data-testid="capacitance-difference" className={comparison.beyondWarning ? 'font-medium text-watch' : 'text-ink-muted'}>
                <span className="numeric">
                  {comparison.differencePct >= 0 ? '+' : '−'}
                  {Math.abs(comparison.differencePct).toLocaleString(readerLocale(), { maximumFractionDigits: 1, minimumFractionDigits: 1 })}
                </span>{' '}
                % from the nameplate's value.
                {comparison.beyondWarning &&
                  ` More than ${capacitanceWarningPct} % apart: check the nameplate and the connection. The unit is saved with a warning.`}
              </p>
            )
          }
        />
        <SelectField
          label="Tolerance"
          registration={register(name('tolerancePreset'))}
          error={errorOf('tolerancePreset')}
          options={Object.entries(tolerancePresetLabels).map(([value, label]) => ({ value, label }))}
        />
        {tolerancePreset === 'custom' && (
          <>
            <NumberField
              label="Lower tolerance"
              unit="%"
              hint="0 or below, e.g. −5"
              registration={register(name('toleranceMinusPct'), { setValueAs: asNumber, shouldUnregister: true })}
              error={errorOf('toleranceMinusPct')}
            />
            <NumberField
              label="Upper tolerance"
              unit="%"
              hint="0 or above, e.g. 10"
              registration={register(name('tolerancePlusPct'), { setValueAs: asNumber, shouldUnregister: true })}
              error={errorOf('tolerancePlusPct')}
            />
          </>
        )}
      </FieldGroup>

      <FieldGroup legend="Record" columns={3}>
        <TextField label="Serial number" registration={register(name('serial'))} error={errorOf('serial')} input={{ spellCheck: false }} />
        <TextField label="Maker" registration={register(name('maker'))} error={errorOf('maker')} />
        <TextField label="Model" registration={register(name('model'))} error={errorOf('model')} />
        <TextField
          label="Temperature category"
          hint="e.g. −25/D"
          registration={register(name('temperatureCategory'))}
          error={errorOf('temperatureCategory')}
        />
        <NumberField
          label="Discharge time"
          unit="s"
          hint="To a safe voltage, as marked; 180 s is common"
          registration={register(name('dischargeTimeS'), { setValueAs: asNumber })}
          error={errorOf('dischargeTimeS')}
          input={{ inputMode: 'numeric' }}
        />
        <DateField label="Installed on" hint="Optional" registration={register(name('installedOn'), { setValueAs: asNullableText })} error={errorOf('installedOn')} />
      </FieldGroup>
    </div>
  );
}
