import { useMutation, useQueryClient } from '@tanstack/react-query';
import { siteCreate, type Site, type SiteCreate } from '@varden/schemas';
import { useState, type ReactNode } from 'react';
import { useForm, useWatch, type DefaultValues } from 'react-hook-form';
import type { z } from 'zod';
import { zodResolver } from '../../../lib/schema-messages';
import { siteMutations } from '../api/site-queries';
import { FormActions } from './form-actions';
import { FieldGroup, NumberField, SelectField, TextField } from './form-field';
import { asNullableNumber, asNumber } from './form-values';
import { applyServerErrors, type FormFailure } from './server-errors';

type SiteValues = SiteCreate;
type SiteOutput = z.output<typeof siteCreate>;

const fieldNames = Object.keys(siteCreate.shape);

// Chromium's list leaves out "UTC" itself, the contract's default: always offer it.
const timeZones = (() => {
  try {
    return ['UTC', ...Intl.supportedValuesOf('timeZone').filter((zone) => zone !== 'UTC')];
  } catch {
    return ['UTC'];
  }
})();

function browserTimeZone(): string {
  try {
    const zone = Intl.DateTimeFormat().resolvedOptions().timeZone;
    return timeZones.includes(zone) ? zone : 'UTC';
  } catch {
    return 'UTC';
  }
}

function defaultsOf(site: Site | undefined): DefaultValues<SiteValues> {
  if (site) {
    const { id: _id, bankCount: _b, retiredAt: _r, version: _v, createdAt: _c, updatedAt: _u, ...fields } = site;
    return fields;
  }
  return {
    name: '',
    address: '',
    voltageV: 400,
    frequencyHz: 50,
    transformerImpedancePct: 6,
    utilityShortCircuitKva: null,
    targetPf: 0.95,
    tariffBasis: 'pf-threshold',
    tariffLimit: 0.9,
    pricePerKvarh: 0,
    currency: 'EUR',
    timeZone: browserTimeZone(),
    plannedLoadKw: null,
    plannedLoadPf: null,
  };
}

type SiteFormProps = {
  /** The site to change; a new site when absent. */
  site?: Site;
  onSaved: (site: Site) => void;
  cancel?: ReactNode;
};

/** A site's name, network, supply transformer, PF target and tariff, checked by the shared siteCreate schema. */
export function SiteForm({ site, onSaved, cancel }: SiteFormProps) {
  const queryClient = useQueryClient();
  const create = useMutation(siteMutations.create(queryClient));
  const update = useMutation(siteMutations.update(queryClient));
  const [failure, setFailure] = useState<FormFailure | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    control,
    formState: { errors, isSubmitting },
  } = useForm<SiteValues, unknown, SiteOutput>({
    resolver: zodResolver(siteCreate),
    defaultValues: defaultsOf(site),
    mode: 'onTouched',
  });
  const tariffBasis = useWatch({ control, name: 'tariffBasis' });
  const currency = useWatch({ control, name: 'currency' });

  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    try {
      const saved = site ? await update.mutateAsync({ id: site.id, body: { ...values, version: site.version } }) : await create.mutateAsync(values);
      onSaved(saved);
    } catch (error) {
      setFailure(applyServerErrors(error, setError, fieldNames));
    }
  });

  return (
    <form noValidate onSubmit={onSubmit} className="grid max-w-content gap-8">
      <FieldGroup legend="Site">
        <TextField label="Name" registration={register('name')} error={errors.name} input={{ autoComplete: 'organization' }} />
        <TextField label="Address" registration={register('address')} error={errors.address} input={{ autoComplete: 'street-address' }} />
      </FieldGroup>

      <FieldGroup legend="Network and supply" columns={3}>
        <NumberField label="Network voltage" unit="V" hint="Line to line" registration={register('voltageV', { setValueAs: asNumber })} error={errors.voltageV} />
        <SelectField
          label="Frequency"
          unit="Hz"
          registration={register('frequencyHz', { setValueAs: Number })}
          error={errors.frequencyHz}
          options={[
            { value: '50', label: '50' },
            { value: '60', label: '60' },
          ]}
        />
        <NumberField label="Transformer rating" unit="kVA" registration={register('transformerKva', { setValueAs: asNumber })} error={errors.transformerKva} />
        <NumberField
          label="Transformer impedance"
          unit="%"
          registration={register('transformerImpedancePct', { setValueAs: asNumber })}
          error={errors.transformerImpedancePct}
        />
        <NumberField
          label="Utility short-circuit power"
          unit="kVA"
          hint="Optional, when the utility gives it"
          registration={register('utilityShortCircuitKva', { setValueAs: asNullableNumber })}
          error={errors.utilityShortCircuitKva}
        />
        <SelectField
          label="Time zone"
          registration={register('timeZone')}
          error={errors.timeZone}
          options={(site && !timeZones.includes(site.timeZone) ? [site.timeZone, ...timeZones] : timeZones).map((zone) => ({ value: zone, label: zone }))}
        />
      </FieldGroup>

      <FieldGroup legend="Power factor and tariff" columns={3}>
        <NumberField label="PF target" hint="The power factor the site aims for, e.g. 0.95" registration={register('targetPf', { setValueAs: asNumber })} error={errors.targetPf} />
        <SelectField
          label="Tariff basis"
          registration={register('tariffBasis')}
          error={errors.tariffBasis}
          options={[
            { value: 'pf-threshold', label: 'PF threshold' },
            { value: 'tan-phi-limit', label: 'tan φ limit' },
          ]}
        />
        <NumberField
          label={tariffBasis === 'tan-phi-limit' ? 'tan φ limit' : 'PF threshold'}
          hint={tariffBasis === 'tan-phi-limit' ? 'Reactive energy is charged above this tan φ, e.g. 0.4' : 'Charged below this power factor, e.g. 0.90'}
          registration={register('tariffLimit', { setValueAs: asNumber })}
          error={errors.tariffLimit}
        />
        <NumberField
          label="Price per kvarh"
          unit={currency && /^[A-Z]{3}$/.test(currency) ? `${currency}/kvarh` : '/kvarh'}
          hint="0 when reactive energy is not charged"
          registration={register('pricePerKvarh', { setValueAs: asNumber })}
          error={errors.pricePerKvarh}
        />
        <TextField
          label="Currency"
          hint="Three letters, e.g. EUR or USD"
          registration={register('currency', { setValueAs: (v: string) => v.trim().toUpperCase() })}
          error={errors.currency}
          input={{ autoCapitalize: 'characters' }}
        />
      </FieldGroup>

      <FieldGroup legend="Planned load (optional)">
        <NumberField
          label="Planned active load"
          unit="kW"
          registration={register('plannedLoadKw', { setValueAs: asNullableNumber })}
          error={errors.plannedLoadKw}
        />
        <NumberField
          label="Power factor of that load, uncorrected"
          registration={register('plannedLoadPf', { setValueAs: asNullableNumber })}
          error={errors.plannedLoadPf}
        />
      </FieldGroup>

      <FormActions failure={failure} submitting={isSubmitting} submitLabel={site ? 'Save the site' : 'Add the site'} cancel={cancel} />
    </form>
  );
}
