import { useQuery } from '@tanstack/react-query';
import type { ComponentPropsWithRef } from 'react';
import { bankQueries } from '../../register/api/bank-queries';
import { siteQueries } from '../../register/api/site-queries';
import { SelectField } from './form-controls';

type BankPickerProps = {
  siteId: number | undefined;
  onSiteChange: (siteId: number | undefined) => void;
  /** The bank select's own props from react-hook-form's register('bankId'). */
  bankField: ComponentPropsWithRef<'select'>;
  bankError?: string | undefined;
  disabled?: boolean;
};

/** Site first, then one of its banks in service: the register's own lists. */
export function BankPicker({ siteId, onSiteChange, bankField, bankError, disabled = false }: BankPickerProps) {
  const sites = useQuery(siteQueries.list({ page: 1, pageSize: 200, sort: 'name', q: '' }));
  const banks = useQuery({ ...bankQueries.list({ page: 1, pageSize: 200, sort: 'name', q: '', ...(siteId ? { siteId } : {}) }), enabled: siteId !== undefined });
  const bankOptions = siteId === undefined ? [] : (banks.data?.items ?? []).filter((bank) => bank.siteId === siteId && !bank.retiredAt);
  return (
    <>
      <SelectField
        label="Site"
        value={siteId ? String(siteId) : ''}
        onChange={(event) => onSiteChange(event.target.value ? Number(event.target.value) : undefined)}
        placeholder={sites.isPending ? 'Loading the sites…' : 'Choose a site'}
        options={(sites.data?.items ?? []).map((site) => ({ value: String(site.id), label: site.name }))}
        disabled={disabled}
        {...(sites.isError ? { error: `Could not load the sites: ${sites.error.message}` } : {})}
      />
      <SelectField
        label="Bank"
        {...bankField}
        placeholder={siteId === undefined ? 'Choose a site first' : banks.isPending ? 'Loading the banks…' : bankOptions.length === 0 ? 'This site has no banks in service' : 'Choose a bank'}
        options={bankOptions.map((bank) => ({ value: String(bank.id), label: bank.location ? `${bank.name} (${bank.location})` : bank.name }))}
        error={bankError}
        disabled={disabled || siteId === undefined}
      />
    </>
  );
}
