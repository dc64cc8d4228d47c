import { roles, type Role } from '@varden/schemas';
import { CheckboxGroup } from '../../../components/form/checkbox-group';
import { roleDescriptions, roleLabels } from '../../auth/lib/role-labels';

const options = roles.map((role) => ({ value: role, label: roleLabels[role], description: roleDescriptions[role] }));

type RoleCheckboxesProps = {
  value: readonly Role[];
  onChange: (roles: Role[]) => void;
  onBlur?: () => void;
  error?: string | undefined;
  hint?: string;
};

/** One checkbox per role, each with what the role gets done. */
export function RoleCheckboxes({ value, onChange, onBlur, error, hint }: RoleCheckboxesProps) {
  return (
    <CheckboxGroup
      legend="Roles"
      hint={hint ?? 'One or more. Each role opens its own part of Varden.'}
      options={options}
      value={value}
      onChange={onChange}
      {...(onBlur ? { onBlur } : {})}
      error={error}
    />
  );
}
