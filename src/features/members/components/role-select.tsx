import { ROLES, ROLE_LABELS, type Role } from '@shared/roles';
import { controlClasses } from '@/components/ui/field-shell';

export interface RoleSelectProps {
  value: Role;
  onChange: (role: Role) => void;
  /** Names the select for screen readers, e.g. "Role of Tomas Reyes". */
  label: string;
  disabled?: boolean;
  /** Id of the text that says why the select is disabled. */
  describedBy?: string;
}

/** A compact select for a table cell, where a visible label would repeat the column header. */
export function RoleSelect({ value, onChange, label, disabled, describedBy }: RoleSelectProps) {
  return (
    <select aria-label={label} aria-describedby={describedBy} value={value} disabled={disabled} onChange={(e) => onChange(e.target.value as Role)} className={controlClasses(false, 'h-8 w-36')}>
      {ROLES.map((role) => (
        <option key={role} value={role}>
          {ROLE_LABELS[role]}
        </option>
      ))}
    </select>
  );
}
