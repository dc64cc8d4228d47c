import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { CheckboxGroup } from '../../../components/form/checkbox-group';
import { FormAlert } from '../../../components/form/form-alert';
import { TextField } from '../../../components/form/text-field';
import { siteChoices } from '../api/site-choices-queries';

type SiteGrantPickerProps = {
  value: readonly number[];
  onChange: (siteIds: number[]) => void;
  onBlur?: () => void;
  error?: string | undefined;
};

/** With more sites than this, a box to narrow the list by name appears. */
const filterFrom = 8;

/** The sites a viewer may read: every site in the register as a checkbox, narrowed by name when the list is long. */
export function SiteGrantPicker({ value, onChange, onBlur, error }: SiteGrantPickerProps) {
  const choices = useQuery(siteChoices.list());
  const [filter, setFilter] = useState('');

  if (choices.isPending) return <p className="text-ink-muted">Loading the sites…</p>;
  if (choices.isError) {
    return (
      <FormAlert>
        <p className="font-medium">Could not load the list of sites: {choices.error.message}</p>
        <p className="mt-1">The sites granted now stay as they are{value.length > 0 ? ` (site ${value.join(', ')})` : ''}.</p>
      </FormAlert>
    );
  }

  const sites = choices.data.items;
  const needle = filter.trim().toLocaleLowerCase();
  const known = new Set(sites.map((site) => site.id));
  const options = [
    ...sites
      .filter((site) => needle === '' || site.name.toLocaleLowerCase().includes(needle) || value.includes(site.id))
      .map((site) => ({ value: site.id, label: site.name, ...(site.address ? { description: site.address } : {}) })),
    // A grant to a site this list does not hold (retired since) stays visible so it can be removed.
    ...value.filter((id) => !known.has(id)).map((id) => ({ value: id, label: `Site ${id}`, description: 'Not in the current register' })),
  ];

  return (
    <div className="grid gap-3">
      {sites.length > filterFrom && (
        <TextField label="Find a site" type="search" value={filter} onChange={(event) => setFilter(event.target.value)} autoComplete="off" />
      )}
      <CheckboxGroup
        legend="Sites this viewer may read"
        hint={
          sites.length === 0
            ? 'The register has no sites yet. Grant sites once a planner has added them.'
            : `${value.length} of ${sites.length} granted. A viewer sees only these sites and their records.`
        }
        options={options}
        value={value}
        onChange={onChange}
        {...(onBlur ? { onBlur } : {})}
        error={error}
        columns={2}
      />
    </div>
  );
}
